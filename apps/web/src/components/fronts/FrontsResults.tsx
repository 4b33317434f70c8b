"use client";

import type { FrontsContest, FrontsEquilibrium } from "@contend/solver";
import { readAllocation } from "@contend/solver";
import { formatMoney, formatNumber, formatPercent } from "../../lib/format";
import { frontExplorerLink } from "../../lib/frontsState";
import { FigureTable, RowHeader, numCol, textCol } from "../FigureTable";

/** What the result views of the fronts explorer draw from. */
export interface FrontsView {
  fc: FrontsContest;
  eq: FrontsEquilibrium;
  currency: string | null;
}

/** The equilibrium split: money per front, budgets and shadow prices, shares, and the reading. */
export function FrontsResults({ fc, eq, currency }: FrontsView) {
  const money = (v: number) => formatMoney(v, currency);
  const per = currency ? `per 1 ${currency}` : "per unit of money";
  if (eq.kind === "none-pure" || !eq.spends) {
    // without budgets each all-pay front is a contest of its own, solved by the single explorer
    const alone = fc.rivals.every((r) => r.budget === Infinity)
      ? fc.fronts.flatMap((f, k) => (f.csf.kind === "allpay" ? [k] : []))
      : [];
    return (
      <section className="card" aria-labelledby="fronts-eq-title" data-testid="fronts-eq">
        <h2 id="fronts-eq-title">Equilibrium</h2>
        <p data-testid="fronts-eq-none">{eq.note ?? "No pure-strategy equilibrium found."}</p>
        {alone.length > 0 && (
          <ul data-testid="fronts-alone-links">
            {alone.map((k) => (
              <li key={k}>
                <a href={frontExplorerLink(fc, k, currency)} data-testid={`fronts-alone-${k}`}>
                  {fc.fronts[k]!.name} alone in the single-contest explorer
                </a>{" "}
                (its mixed equilibrium; without budgets the fronts are independent contests)
              </li>
            ))}
          </ul>
        )}
      </section>
    );
  }
  const spends = eq.spends;
  const reading = readAllocation(fc, spends);
  const names = (ks: number[]) => ks.map((k) => fc.fronts[k]!.name).join(", ") || "none";
  return (
    <section className="card" aria-labelledby="fronts-eq-title" data-testid="fronts-eq">
      <h2 id="fronts-eq-title">Equilibrium split of the budgets</h2>
      <p className="small muted">
        Pure equilibrium · Nash gap {money(eq.nashGap)} (the most any rival could gain by
        re-splitting its own budget) · method {eq.method}
      </p>
      <FigureTable
        caption={`Money spent on each front (${currency ?? "money"})`}
        testId="fronts-spend-table"
        head={[
          textCol("Rival"),
          ...fc.fronts.map((f) => numCol(f.name)),
          numCol("Total"),
          numCol("Budget"),
          numCol(`Shadow price ${per}`, "shadow"),
          numCol("Payoff"),
        ]}
      >
        {fc.rivals.map((r, i) => {
          const sp = eq.shadowPrices?.[i];
          return (
            <tr key={r.name}>
              <RowHeader>{r.name}</RowHeader>
              {spends[i]!.map((s, k) => (
                <td key={k} className="num" data-testid={`fronts-spend-${i}-${k}`}>
                  {money(s)}
                </td>
              ))}
              <td className="num" data-testid={`fronts-used-${i}`}>
                {money(eq.budgetUsed![i]!)}
              </td>
              <td className="num">
                {Number.isFinite(r.budget) ? money(r.budget) : "none"}
                {r.sunkBudget ? " (sunk)" : ""}
              </td>
              <td className="num" data-testid={`fronts-shadow-${i}`}>
                {sp === null || sp === undefined ? "no budget" : formatNumber(sp, 3)}
              </td>
              <td className="num">{money(eq.payoffs![i]!)}</td>
            </tr>
          );
        })}
        <tr>
          <RowHeader>All rivals</RowHeader>
          {eq.frontTotals!.map((t, k) => (
            <td key={k} className="num">
              {money(t)}
            </td>
          ))}
          <td className="num">{money(eq.frontTotals!.reduce((a, b) => a + b, 0))}</td>
          <td />
          <td />
          <td />
        </tr>
      </FigureTable>
      <p className="small muted">
        Shadow price: what one more unit of budget would add to the rival&apos;s payoff (0 when its
        budget does not bind).
      </p>
      <FigureTable
        caption="Share won on each front (win probability or market share)"
        testId="fronts-share-table"
        head={[textCol("Rival"), ...fc.fronts.map((f) => numCol(f.name))]}
      >
        {fc.rivals.map((r, i) => (
          <tr key={r.name}>
            <RowHeader>{r.name}</RowHeader>
            {eq.shares![i]!.map((p, k) => (
              <td key={k} className="num">
                {formatPercent(p)}
              </td>
            ))}
          </tr>
        ))}
      </FigureTable>
      <h3>Where each rival concentrates and where it concedes</h3>
      <ul data-testid="fronts-reading">
        {reading.map((x, i) => (
          <li key={fc.rivals[i]!.name}>
            <strong>{fc.rivals[i]!.name}</strong> concentrates on {names(x.concentrates)}; concedes{" "}
            {names(x.concedes)}.
          </li>
        ))}
      </ul>
      <p className="small muted">
        Against a split in proportion to what each front is worth to the rival: concentrating means
        at least 1.25 times that share of its money, conceding less than 2% of it (display
        thresholds, not results of the model).
      </p>
    </section>
  );
}
