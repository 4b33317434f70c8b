import type { Metadata } from "next";
import { Suspense } from "react";
import { Calibrator } from "../../components/calibrate/Calibrator";

export const metadata: Metadata = { title: "Calibrate" };

export default function CalibratePage() {
  return (
    <Suspense fallback={<p className="muted">Loading…</p>}>
      <Calibrator />
    </Suspense>
  );
}
