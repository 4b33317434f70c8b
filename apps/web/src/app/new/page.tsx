import type { Metadata } from "next";
import { Suspense } from "react";
import { ScenarioEditor } from "../../components/ScenarioEditor";

export const metadata: Metadata = { title: "New session" };

export default function NewSessionPage() {
  return (
    <Suspense fallback={<p className="muted">Loading the editor…</p>}>
      <ScenarioEditor />
    </Suspense>
  );
}
