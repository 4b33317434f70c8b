"use client";

import { useMemo } from "react";
import { respond, shares } from "@contend/solver";
import type { Contest } from "@contend/solver";
import { formatMoney, formatPercent } from "../../lib/format";
import { FigureTable, numCol, RowHeader, textCol } from "../FigureTable";
import { Term } from "../Glossary";

/** Shares, payoffs, best replies and regrets at a picked effort profile, and the largest regret. */
export function ProfileTable({
  contest,
  profile,
  currency,
}: {
  contest: Contest;
  profile: number[] | null;
  currency: string | null;
}) {
  const money = (v: number) => formatMoney(v, currency);
  const profileEval = useMemo(() => {
    if (!profile || profile.length !== contest.rivals.length) return null;
    return { ...respond(contest, profile), shares: shares(contest, profile) };
  }, [contest, profile]);
  return (
    <>
      <FigureTable
        head={[
          textCol("Rival"),
          numCol("Share"),
          numCol("Payoff"),
          numCol(<Term id="best-reply" />, "Best reply"),
          numCol(<Term id="regret" />, "Regret"),
        ]}
        caption="At the picked profile"
        testId="profile-table"
        wrapStyle={{ minHeight: "9rem" }}
      >
        {contest.rivals.map((r, i) => (
          <tr key={i}>
            <RowHeader>{r.name}</RowHeader>
            <td className="num" data-testid={`profile-share-${i}`}>
              {profileEval ? formatPercent(profileEval.shares[i] ?? NaN) : "\u2013"}
            </td>
            <td className="num" data-testid={`profile-payoff-${i}`}>
              {profileEval ? money(profileEval.payoffs[i] ?? NaN) : "\u2013"}
            </td>
            <td className="num" data-testid={`profile-br-${i}`}>
              {profileEval ? money(profileEval.bestResponses[i] ?? NaN) : "\u2013"}
            </td>
            <td className="num" data-testid={`profile-regret-${i}`}>
              {profileEval ? money(profileEval.regrets[i] ?? NaN) : "\u2013"}
            </td>
          </tr>
        ))}
      </FigureTable>
      <p className="small" data-testid="profile-gap" style={{ minHeight: "1.5em" }}>
        {profileEval ? (
          <>
            Largest <Term id="regret">regret</Term> (how far this profile is from{" "}
            <Term id="equilibrium">equilibrium</Term>; 0 at equilibrium):{" "}
            {money(profileEval.nashGap)}
          </>
        ) : (
          ""
        )}
      </p>
    </>
  );
}
