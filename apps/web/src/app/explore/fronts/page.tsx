import type { Metadata } from "next";
import { Suspense } from "react";
import { FrontsExplorer } from "../../../components/fronts/FrontsExplorer";

export const metadata: Metadata = { title: "Several fronts, one budget" };

export default function FrontsPage() {
  return (
    <Suspense fallback={<p className="muted">Loading the fronts explorer…</p>}>
      <FrontsExplorer />
    </Suspense>
  );
}
