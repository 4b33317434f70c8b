import type { Metadata } from "next";
import { Suspense } from "react";
import { JoinFlow } from "../../components/live/JoinFlow";

export const metadata: Metadata = { title: "Join a session" };

export default function JoinPage() {
  return (
    <Suspense fallback={<p className="muted">Loading…</p>}>
      <JoinFlow />
    </Suspense>
  );
}
