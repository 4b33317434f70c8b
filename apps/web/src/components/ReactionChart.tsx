"use client";

import { Fragment } from "react";
import type { KeyboardEvent, MouseEvent } from "react";
import type { CurvePoint } from "../lib/brCurves";
import { PAPER, seriesColour } from "../lib/palette";

const W = 520;
const H = 400;
const PAD = { left: 64, right: 16, top: 16, bottom: 48 };

function niceTicks(max: number, count = 5): number[] {
  if (!(max > 0)) return [0];
  const raw = max / count;
  const mag = 10 ** Math.floor(Math.log10(raw));
  const step = [1, 2, 2.5, 5, 10].map((m) => m * mag).find((s) => s >= raw) ?? raw;
  const out: number[] = [];
  for (let v = 0; v <= max + 1e-9 * max; v += step) out.push(v);
  return out;
}

/**
 * Both best-response curves in the effort plane (rival 0 across, rival 1 up), the equilibrium
 * where they cross, and the profile the user picked. Click anywhere to pick a profile; the
 * arrow keys move it when the chart has focus.
 */
export function ReactionChart({
  curves,
  max,
  names,
  equilibrium,
  profile,
  onPick,
  format,
}: {
  curves: [CurvePoint[], CurvePoint[]];
  max: number;
  names: [string, string];
  equilibrium: readonly number[] | null;
  profile: readonly number[] | null;
  onPick: (p: [number, number]) => void;
  format: (v: number) => string;
}) {
  const iw = W - PAD.left - PAD.right;
  const ih = H - PAD.top - PAD.bottom;
  const sx = (v: number) => PAD.left + (Math.min(v, max) / max) * iw;
  const sy = (v: number) => PAD.top + ih - (Math.min(v, max) / max) * ih;
  const path = (pts: CurvePoint[]) =>
    pts
      .map((p, k) => `${k === 0 ? "M" : "L"}${sx(p.e0).toFixed(1)},${sy(p.e1).toFixed(1)}`)
      .join("");
  const ticks = niceTicks(max);

  function click(e: MouseEvent<SVGSVGElement>) {
    const box = e.currentTarget.getBoundingClientRect();
    const x = ((e.clientX - box.left) / box.width) * W;
    const y = ((e.clientY - box.top) / box.height) * H;
    const e0 = ((x - PAD.left) / iw) * max;
    const e1 = ((PAD.top + ih - y) / ih) * max;
    if (e0 < -0.02 * max || e1 < -0.02 * max || e0 > max * 1.02 || e1 > max * 1.02) return;
    onPick([Math.max(0, e0), Math.max(0, e1)]);
  }

  function key(e: KeyboardEvent<SVGSVGElement>) {
    const step = max / 50;
    const cur = profile ?? equilibrium ?? [max / 2, max / 2];
    const p: [number, number] = [cur[0] ?? 0, cur[1] ?? 0];
    if (e.key === "ArrowRight") p[0] += step;
    else if (e.key === "ArrowLeft") p[0] = Math.max(0, p[0] - step);
    else if (e.key === "ArrowUp") p[1] += step;
    else if (e.key === "ArrowDown") p[1] = Math.max(0, p[1] - step);
    else return;
    e.preventDefault();
    onPick(p);
  }

  return (
    <svg
      viewBox={`0 0 ${W} ${H}`}
      width="100%"
      style={{ maxWidth: W, height: "auto", display: "block", cursor: "crosshair" }}
      role="application"
      aria-label={`Best-response curves. ${names[0]} effort across, ${names[1]} effort up. Click or use arrow keys to pick a profile.`}
      tabIndex={0}
      onClick={click}
      onKeyDown={key}
      data-testid="reaction-chart"
      data-slide-chart
    >
      <rect x={PAD.left} y={PAD.top} width={iw} height={ih} fill="#fbfcfd" stroke="#d5dbe2" />
      {ticks.map((t) => (
        <g key={t}>
          <line x1={sx(t)} x2={sx(t)} y1={PAD.top} y2={PAD.top + ih} stroke="#eceff3" />
          <line x1={PAD.left} x2={PAD.left + iw} y1={sy(t)} y2={sy(t)} stroke="#eceff3" />
          <text x={sx(t)} y={PAD.top + ih + 16} fontSize="11" textAnchor="middle" fill={PAPER.axis}>
            {format(t)}
          </text>
          <text x={PAD.left - 6} y={sy(t) + 4} fontSize="11" textAnchor="end" fill={PAPER.axis}>
            {format(t)}
          </text>
        </g>
      ))}
      <text x={PAD.left + iw / 2} y={H - 8} fontSize="12" textAnchor="middle" fill="#17202b">
        Effort of {names[0]}
      </text>
      <text
        x={14}
        y={PAD.top + ih / 2}
        fontSize="12"
        textAnchor="middle"
        fill="#17202b"
        transform={`rotate(-90 14 ${PAD.top + ih / 2})`}
      >
        Effort of {names[1]}
      </text>
      <path d={path(curves[0])} fill="none" stroke={seriesColour(0)} strokeWidth={2.5} />
      <path
        d={path(curves[1])}
        fill="none"
        stroke={seriesColour(1)}
        strokeWidth={2.5}
        strokeDasharray="7 4"
      />
      {equilibrium ? (
        <g>
          <circle cx={sx(equilibrium[0] ?? 0)} cy={sy(equilibrium[1] ?? 0)} r={6} fill="#17202b" />
          <text
            x={sx(equilibrium[0] ?? 0) + 9}
            y={sy(equilibrium[1] ?? 0) - 8}
            fontSize="12"
            fill="#17202b"
          >
            equilibrium
          </text>
        </g>
      ) : null}
      {profile ? (
        <g>
          <circle
            cx={sx(profile[0] ?? 0)}
            cy={sy(profile[1] ?? 0)}
            r={6}
            fill="none"
            stroke="#b42318"
            strokeWidth={2.5}
          />
          <text
            x={sx(profile[0] ?? 0) + 9}
            y={sy(profile[1] ?? 0) + 16}
            fontSize="12"
            fill="#b42318"
          >
            your profile
          </text>
        </g>
      ) : null}
      <g fontSize="12">
        {[0, 1].map((k) => (
          <Fragment key={k}>
            <line
              x1={PAD.left + 10}
              x2={PAD.left + 34}
              y1={PAD.top + 14 + 18 * k}
              y2={PAD.top + 14 + 18 * k}
              stroke={seriesColour(k)}
              strokeWidth={2.5}
              strokeDasharray={k === 1 ? "7 4" : undefined}
            />
            <text x={PAD.left + 40} y={PAD.top + 18 + 18 * k} fill="#17202b">
              best reply of {names[k]}
            </text>
          </Fragment>
        ))}
      </g>
    </svg>
  );
}
