/**
 * Reading and checking a spend-and-share panel (src/calibrate/panelCsv.ts, panel.ts): every class
 * of bad input comes back as one problem naming the row, column, period or rival; usable input
 * in any column order, with extra columns, percentages and dropped rows.
 */
import { describe, expect, it } from "vitest";
import {
  calibrate,
  parsePanelCsv,
  validateScenario,
  type Calibration,
  type InputError,
} from "../src/index";

function fitCsv(text: string): { ok: true; value: Calibration } | InputError {
  const rows = parsePanelCsv(text);
  if (!rows.ok) return rows;
  return calibrate(rows.value, { resamples: 50 });
}

function csv(lines: string[]): string {
  return `${lines.join("\n")}\n`;
}

/** A small valid panel: 3 rivals, 4 periods, relative spends moving, shares from r = 0.7. */
function goodLines(): string[] {
  const spends = [
    [100, 200, 50],
    [120, 180, 70],
    [90, 240, 40],
    [150, 160, 60],
  ];
  const w = [1, 1.4, 0.8];
  const out = ["period,rival,spend,share"];
  spends.forEach((s, t) => {
    const noise = [1, 1.05, 0.97].map((x, i) => (t % 2 === 0 ? x : 1 / x) ** (i + 1));
    const att = s.map((x, i) => w[i]! * x ** 0.7 * noise[i]!);
    const tot = att.reduce((a, b) => a + b, 0);
    s.forEach((x, i) => out.push(`T${t + 1},R${i + 1},${x},${att[i]! / tot}`));
  });
  return out;
}

function expectBad(text: string, path: string | RegExp, message: RegExp) {
  const r = fitCsv(text);
  expect(r.ok).toBe(false);
  if (r.ok) return;
  if (typeof path === "string") expect(r.path).toBe(path);
  else expect(r.path).toMatch(path);
  expect(r.message).toMatch(message);
  expect(`${r.path}: ${r.message}`).not.toContain("\n");
}

describe("parsePanelCsv + calibrate: usable input", () => {
  it("the valid panel fits", () => {
    const r = fitCsv(csv(goodLines()));
    expect(r.ok).toBe(true);
  });

  it("any column order, extra columns ignored, header case and spaces, semicolons, quotes and a byte-order mark give the same fit", () => {
    const base = fitCsv(csv(goodLines()));
    const reordered = goodLines().map((line, k) => {
      const [p, r, s, q] = line.split(",");
      return k === 0 ? ` Share ;note;RIVAL; spend ;Period` : `${q};"x; y";"${r}";${s};${p}`;
    });
    const other = fitCsv(`\ufeff${csv(reordered)}`);
    if (!base.ok || !other.ok) throw new Error("fit failed");
    expect(other.value.decisiveness).toEqual(base.value.decisiveness);
    expect(other.value.rivals).toEqual(["R1", "R2", "R3"]);
  });

  it("shares as percentages with % read as fractions", () => {
    const lines = goodLines().map((line, k) => {
      if (k === 0) return line;
      const cells = line.split(",");
      return [...cells.slice(0, 3), `${Number(cells[3]) * 100}%`].join(",");
    });
    const a = fitCsv(csv(goodLines()));
    const b = fitCsv(csv(lines));
    if (!a.ok || !b.ok) throw new Error("fit failed");
    expect(b.value.decisiveness.estimate).toBeCloseTo(a.value.decisiveness.estimate, 10);
  });

  it("rows with zero spend or zero share are dropped and counted, never silently", () => {
    const lines = goodLines();
    lines.push("T5,R1,0,0", "T5,R2,100,0.6", "T5,R3,80,0.4");
    const r = fitCsv(csv(lines));
    if (!r.ok) throw new Error(r.message);
    expect(r.value.fit.dropped).toBe(1);
    expect(r.value.fit.observations).toBe(14);
    expect(r.value.fit.periods).toBe(5);
  });

  it("a period left with one usable row is dropped whole, its rows counted", () => {
    const lines = goodLines();
    lines.push("T5,R1,0,0", "T5,R2,100,1", "T5,R3,0,0");
    const r = fitCsv(csv(lines));
    if (!r.ok) throw new Error(r.message);
    expect(r.value.fit.dropped).toBe(3);
    expect(r.value.fit.periods).toBe(4);
  });
});

describe("parsePanelCsv + calibrate: every class of bad input names where", () => {
  it("missing column", () => {
    const lines = goodLines().map((l) => l.split(",").slice(0, 3).join(","));
    expectBad(csv(lines), "column share", /missing from the header/);
  });

  it("a column named twice", () => {
    const lines = goodLines().map((l, k) => (k === 0 ? `${l},spend` : `${l},1`));
    expectBad(csv(lines), "column spend", /twice/);
  });

  it("non-numeric spend", () => {
    const lines = goodLines();
    lines[3] = "T1,R3,lots,0.2";
    expectBad(csv(lines), "row 4, column spend", /not a number \(got "lots"\)/);
  });

  it("spend with a thousands separator gets a hint", () => {
    const lines = goodLines();
    lines[3] = 'T1,R3,"1,200",0.2';
    expectBad(csv(lines), "row 4, column spend", /thousands separators/);
  });

  it("negative spend", () => {
    const lines = goodLines();
    lines[2] = "T1,R2,-5,0.4";
    expectBad(csv(lines), "row 3, column spend", /must be >= 0 \(got -5\)/);
  });

  it("non-numeric or out-of-range share", () => {
    const lines = goodLines();
    lines[2] = "T1,R2,200,high";
    expectBad(csv(lines), "row 3, column share", /not a number/);
    lines[2] = "T1,R2,200,40";
    expectBad(csv(lines), "row 3, column share", /fraction from 0 to 1 or a percentage with %/);
  });

  it("an empty cell, and a row with too few fields", () => {
    const lines = goodLines();
    lines[2] = "T1,R2,,0.4";
    expectBad(csv(lines), "row 3, column spend", /is empty/);
    lines[2] = "T1,R2";
    expectBad(csv(lines), "row 3, column spend", /missing/);
  });

  it("shares of a period summing outside 0.98-1.02", () => {
    const lines = goodLines();
    const cells = lines[5]!.split(",");
    lines[5] = [...cells.slice(0, 3), String(Number(cells[3]) + 0.05)].join(",");
    expectBad(
      csv(lines),
      /^period "T2" \(rows 5, 6, 7\)$/,
      /shares sum to 1\.05.*outside 0\.98 to 1\.02/,
    );
  });

  it("a rival twice in one period", () => {
    const lines = goodLines();
    lines.push("T1,R1,100,0");
    expectBad(csv(lines), "row 14", /"R1" appears twice in period "T1" \(also row 2\)/);
  });

  it("fewer than 2 rivals", () => {
    expectBad(
      csv(["period,rival,spend,share", "A,X,1,1", "B,X,2,1", "C,X,3,1"]),
      "column rival",
      /only one rival/,
    );
  });

  it("fewer than 3 periods", () => {
    expectBad(csv(goodLines().slice(0, 7)), "column period", /only 2 period/);
  });

  it("a rival with no usable rows", () => {
    const lines = goodLines().map((l, k) => {
      if (k === 0 || !l.includes(",R3,")) return l;
      const [p, r, s] = l.split(",");
      return `${p},${r},${s},0`;
    });
    // shares of the others no longer sum to 1: rescale them
    const byPeriod = new Map<string, number>();
    for (const l of lines.slice(1)) {
      const [p, , , q] = l.split(",");
      byPeriod.set(p!, (byPeriod.get(p!) ?? 0) + Number(q));
    }
    const fixed = lines.map((l, k) => {
      if (k === 0) return l;
      const [p, r, s, q] = l.split(",");
      return `${p},${r},${s},${Number(q) / byPeriod.get(p!)!}`;
    });
    expectBad(csv(fixed), 'rival "R3"', /no usable rows/);
  });

  it("relative spends that never change: r cannot be identified", () => {
    const lines = ["period,rival,spend,share"];
    [1, 2, 3, 4].forEach((scale, t) => {
      const q = [0.3 + 0.05 * (t % 2), 0.5, 0.2 - 0.05 * (t % 2)];
      [100, 200, 50].forEach((s, i) => lines.push(`T${t},R${i},${s * scale},${q[i]}`));
    });
    expectBad(csv(lines), "column spend", /relative spends do not change.*cannot be estimated/);
  });

  it("an estimated r <= 0", () => {
    const lines = ["period,rival,spend,share"];
    [
      [100, 100],
      [200, 100],
      [100, 200],
      [300, 100],
    ].forEach(([a, b], t) => {
      // more spend, less share
      const qa = a! > b! ? 0.35 : a! < b! ? 0.6 : 0.5;
      lines.push(`T${t},A,${a},${qa}`, `T${t},B,${b},${1 - qa}`);
    });
    expectBad(csv(lines), "column share", /r = -.*<= 0.*ratio contest does not describe them/);
  });

  it("an estimated r above the scenario limit of 20", () => {
    const lines = ["period,rival,spend,share"];
    [1, 1.01, 0.99, 1.02].forEach((ratio, t) => {
      const qa = ratio ** 25 / (ratio ** 25 + 1);
      lines.push(`T${t},A,${100 * ratio},${qa}`, `T${t},B,100,${1 - qa}`);
    });
    lines[3] = lines[3]!.replace(/,[^,]*$/, (m) => `,${Number(m.slice(1)) * 1.001}`);
    expectBad(csv(lines), "column share", /above the largest a scenario allows \(20\)/);
  });

  it("too few observations for the residual degrees of freedom", () => {
    // three rivals in pairs over three periods: n = 6, T = 3, N = 3, so n - T - N = 0
    const lines = [
      "period,rival,spend,share",
      "A,X,1,0.4",
      "A,Y,2,0.6",
      "B,X,2,0.5",
      "B,Z,1,0.5",
      "C,Y,1,0.3",
      "C,Z,3,0.7",
    ];
    expectBad(csv(lines), "rows", /no residual degrees of freedom/);
  });

  it("rivals that never meet in a period cannot be compared", () => {
    const lines = ["period,rival,spend,share"];
    for (let t = 0; t < 4; t++) {
      lines.push(
        `A${t},P,${100 + t * 10},${0.4 + 0.02 * t}`,
        `A${t},Q,${100 - t * 5},${0.6 - 0.02 * t}`,
      );
      lines.push(
        `B${t},R,${50 + t * 7},${0.5 + 0.03 * t}`,
        `B${t},S,${60 - t * 3},${0.5 - 0.03 * t}`,
      );
    }
    expectBad(csv(lines), /^rival "(R|S)"$/, /never shares a period with "P"/);
  });

  it("an empty file, a file with only a header, and an unclosed quote", () => {
    expectBad("", "", /empty/);
    expectBad("period,rival,spend,share\n", "rows", /no data rows/);
    expectBad('period,rival,spend,share\nT1,"R1,100,0.5\n', /^row \d+$/, /quote/);
  });

  it("bad seed and resamples options", () => {
    const rows = parsePanelCsv(csv(goodLines()));
    if (!rows.ok) throw new Error(rows.message);
    expect(calibrate(rows.value, { seed: -1 })).toMatchObject({ ok: false, path: "seed" });
    expect(calibrate(rows.value, { resamples: 0 })).toMatchObject({ ok: false, path: "resamples" });
    expect(calibrate(rows.value, { resamples: 2.5 })).toMatchObject({
      ok: false,
      path: "resamples",
    });
  });
});

describe("validateScenario: provenance", () => {
  const base = {
    title: "t",
    prize: 10,
    csf: { kind: "ratio", decisiveness: 0.5 },
    rivals: [
      { name: "A", cost: 1 },
      { name: "B", cost: 1 },
    ],
  };
  const provenance = {
    kind: "calibration",
    source: "x.csv",
    decisiveness: { estimate: 0.5, low: 0.4, high: 0.6 },
    headStarts: [{ rival: "A", estimate: 1, low: 1, high: 1 }],
    revealedValues: [{ rival: "A", estimate: 10, low: 9, high: 11 }],
    fit: { r2: 0.9, rmse: 0.01, observations: 12, periods: 6, dropped: 0 },
    bootstrap: { seed: 1, resamples: 1000 },
  };

  it("a calibration summary is kept as given; null and absent are accepted", () => {
    expect(validateScenario({ ...base, provenance })).toEqual({
      ok: true,
      value: { ...base, provenance },
    });
    expect(validateScenario({ ...base, provenance: null }).ok).toBe(true);
    expect(validateScenario(base).ok).toBe(true);
  });

  it("a bad provenance is refused naming its field", () => {
    const bad = (p: unknown) => validateScenario({ ...base, provenance: p });
    expect(bad({ ...provenance, kind: "guess" })).toMatchObject({
      ok: false,
      path: "provenance.kind",
    });
    expect(bad({ ...provenance, extra: 1 })).toMatchObject({ ok: false, path: "provenance.extra" });
    expect(bad({ ...provenance, decisiveness: { estimate: "x", low: 0, high: 1 } })).toMatchObject({
      ok: false,
      path: "provenance.decisiveness.estimate",
    });
    expect(
      bad({ ...provenance, headStarts: [{ rival: "", estimate: 1, low: 1, high: 1 }] }),
    ).toMatchObject({
      ok: false,
      path: "provenance.headStarts.0.rival",
    });
    expect(bad({ ...provenance, fit: { ...provenance.fit, rmse: Infinity } })).toMatchObject({
      ok: false,
      path: "provenance.fit.rmse",
    });
    expect(bad({ ...provenance, source: "s".repeat(201) })).toMatchObject({
      ok: false,
      path: "provenance.source",
    });
  });
});
