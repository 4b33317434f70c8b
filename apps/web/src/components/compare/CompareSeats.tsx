"use client";

import type { Compared } from "../../lib/compare";
import { formatMoney, formatPercent, formatPlain } from "../../lib/format";
import { FigureTable, numCol, textCol } from "../FigureTable";
import { Term } from "../Glossary";
import { SessionNumber } from "./SessionNumber";

const DASH = "\u2013";

/** Every seat of every compared session: overspend, regret, and how often it was near its best reply. */
export function CompareSeats({ sessions }: { sessions: readonly Compared[] }) {
  return (
    <FigureTable
      head={[
        textCol("Session no."),
        textCol("Rival"),
        textCol("Played by"),
        numCol("Rounds"),
        numCol("Spend ÷ equilibrium spend"),
        numCol(<Term id="regret">Total regret</Term>, "Total regret"),
        numCol(
          <>
            Rounds within 10% of its <Term id="best-reply">best reply</Term>
          </>,
          "Near best reply",
        ),
      ]}
      caption="Seats: regret in each session's currency; within 10% means its spend was within 10% of the best reply's spend"
      testId="compare-seats"
      wrapStyle={{ marginTop: "1rem" }}
    >
      {sessions.flatMap((s, k) =>
        s.summary.seats
          .filter((seat) => seat.rounds > 0)
          .map((seat) => (
            <tr key={`${s.id}-${seat.seat}`} data-session={k + 1}>
              <td>
                <SessionNumber index={k} />
              </td>
              <td>{seat.rival}</td>
              <td>{seat.kind}</td>
              <td className="num">{seat.rounds}</td>
              <td className="num" data-col="overspend">
                {seat.overspend === null ? DASH : `${formatPlain(seat.overspend, 2)}\u00d7`}
              </td>
              <td className="num" data-col="regret">
                {formatMoney(seat.totalRegret, s.summary.session.currency)}
              </td>
              <td className="num" data-col="near">
                {seat.nearBestReply === null ? DASH : formatPercent(seat.nearBestReply)}
              </td>
            </tr>
          )),
      )}
    </FigureTable>
  );
}
