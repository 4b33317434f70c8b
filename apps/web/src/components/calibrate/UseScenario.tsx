"use client";

import type { Scenario } from "@contend/solver";
import { handoffLinks, roundedScenario } from "../../lib/calibrateView";
import { formatMoney, formatNumber } from "../../lib/format";

function download(filename: string, text: string) {
  const blob = new Blob([text], { type: "application/json" });
  const url = URL.createObjectURL(blob);
  const a = document.createElement("a");
  a.href = url;
  a.download = filename;
  a.click();
  URL.revokeObjectURL(url);
}

/** Hands the calibrated scenario on; its provenance travels with it. */
export function UseScenario({ scenario: exact }: { scenario: Scenario }) {
  const scenario = roundedScenario(exact);
  const links = handoffLinks(scenario);
  const currency = scenario.currency ?? null;
  const r = scenario.csf.kind === "ratio" ? scenario.csf.decisiveness : NaN;
  return (
    <div>
      <p className="small">
        Ratio contest, r = {formatNumber(r, 3)}; cost 1 per unit of money (spend = effort); weights
        = head starts; values = revealed values; prize = {formatMoney(scenario.prize, currency)}{" "}
        (the largest revealed value). Money is rounded to whole units, r and weights to 4
        significant digits; the calibration, unrounded, goes with it as the scenario&apos;s
        provenance and shows in the editor and the debrief.
      </p>
      <div className="row">
        <a className="button primary" href={links.editor} data-testid="use-in-editor">
          Edit and start a session
        </a>
        <a className="button" href={links.explorer} data-testid="use-in-explorer">
          Open in the explorer
        </a>
        <button
          type="button"
          onClick={() =>
            download("calibrated-scenario.json", `${JSON.stringify(scenario, null, 2)}\n`)
          }
          data-testid="download-scenario"
        >
          Download scenario JSON
        </button>
      </div>
    </div>
  );
}
