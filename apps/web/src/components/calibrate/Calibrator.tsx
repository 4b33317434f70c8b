"use client";

import { useDeferredValue, useMemo, useState } from "react";
import { DEMO_PANEL } from "@contend/solver";
import { runCalibration } from "../../lib/calibrateView";
import { TextField } from "../Field";
import { CalibrationCautions } from "./CalibrationCautions";
import { CalibrationResults } from "./CalibrationResults";
import { DataInput, type DataSource } from "./DataInput";
import { FitCharts } from "./FitCharts";
import { UseScenario } from "./UseScenario";

function wholeNumber(text: string, fallback: number): number {
  const t = text.trim();
  return t === "" ? fallback : /^\d+$/.test(t) ? Number(t) : NaN;
}

/** The Calibrate page: data in, estimates with intervals, charts, cautions, scenario out. */
export function Calibrator() {
  const [data, setData] = useState<DataSource>({ text: "", source: "" });
  const [title, setTitle] = useState("");
  const [currency, setCurrency] = useState("");
  const [seed, setSeed] = useState("1");
  const [resamples, setResamples] = useState("1000");

  const current = useMemo(
    () => ({ data, title, currency, seed, resamples }),
    [data, title, currency, seed, resamples],
  );
  const input = useDeferredValue(current);
  const outcome = useMemo(() => {
    if (input.data.text.trim() === "") return null;
    return runCalibration({
      text: input.data.text,
      source: input.data.source,
      title: input.title,
      currency: input.currency,
      seed: wholeNumber(input.seed, 1),
      resamples: wholeNumber(input.resamples, 1000),
    });
  }, [input]);

  function loadDemo() {
    setData({ text: DEMO_PANEL.csv, source: DEMO_PANEL.file });
    setTitle(DEMO_PANEL.title);
    setCurrency(DEMO_PANEL.currency);
  }

  const cur = currency.trim() || null;
  return (
    <div aria-labelledby="calibrate-title">
      <h1 id="calibrate-title">Calibrate from past data</h1>
      <p className="muted">
        Bring your market in: what each rival spent per period and the share it won. Contend fits a
        ratio contest to it (log-centred least squares, Cooper &amp; Nakanishi 1988), reveals what
        winning was worth to each rival if its spends were best replies, and turns that into a
        scenario. Everything runs in this browser; the data are not sent anywhere.
      </p>
      <div className="calibrate-top">
        <section className="card" aria-labelledby="calibrate-data-title">
          <h2 id="calibrate-data-title">Data</h2>
          <DataInput
            data={data}
            onData={setData}
            onDemo={loadDemo}
            problem={
              outcome && !outcome.ok
                ? `${outcome.where ? `${outcome.where}: ` : ""}${outcome.message}`
                : null
            }
          />
          <div className="grid-3" style={{ marginTop: "0.5rem" }}>
            <TextField
              label="Scenario title"
              value={title}
              onChange={setTitle}
              placeholder={`Calibrated from ${data.source || "data"}`}
              testId="calibrate-title-field"
            />
            <TextField
              label="Currency"
              value={currency}
              onChange={setCurrency}
              placeholder="e.g. EUR"
              testId="calibrate-currency"
            />
          </div>
          <details>
            <summary className="small">Bootstrap settings</summary>
            <div className="grid-2">
              <TextField
                label="Seed"
                numeric
                value={seed}
                onChange={setSeed}
                testId="calibrate-seed"
              />
              <TextField
                label="Resamples"
                numeric
                value={resamples}
                onChange={setResamples}
                testId="calibrate-resamples"
              />
            </div>
          </details>
        </section>
        <section className="card" aria-labelledby="calibrate-results-title" aria-live="polite">
          <h2 id="calibrate-results-title">Estimates</h2>
          {outcome === null ? (
            <p className="muted" data-testid="calibrate-empty">
              Paste, upload or type the data, or load the invented demo (four regional bakeries,
              twelve quarters).
            </p>
          ) : !outcome.ok ? (
            <p className="notice error" role="alert" data-testid="calibrate-error">
              {outcome.where ? `${outcome.where}: ` : ""}
              {outcome.message}
            </p>
          ) : (
            <CalibrationResults c={outcome.calibration} currency={cur} />
          )}
          <CalibrationCautions />
        </section>
      </div>
      {outcome?.ok && (
        <>
          <section className="card" aria-labelledby="calibrate-use-title">
            <h2 id="calibrate-use-title">Use this scenario</h2>
            <UseScenario scenario={outcome.scenario} />
          </section>
          <section className="card" aria-labelledby="calibrate-fit-title">
            <h2 id="calibrate-fit-title">How well the model fits</h2>
            <FitCharts c={outcome.calibration} />
          </section>
        </>
      )}
    </div>
  );
}
