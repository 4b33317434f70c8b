import type { Metadata } from "next";
import { Suspense } from "react";
import { Explorer } from "../../components/Explorer";

export const metadata: Metadata = { title: "Explorer" };

export default function ExplorePage() {
  return (
    <Suspense fallback={<p className="muted">Loading the explorer…</p>}>
      <Explorer />
    </Suspense>
  );
}
