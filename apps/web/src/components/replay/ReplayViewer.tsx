"use client";

import { useEffect, useMemo, useState } from "react";
import type { SessionExport } from "@contend/protocol";
import { exportSession } from "../../lib/api";
import { formatDateTime } from "../../lib/format";
import { seatNames, STATUS_TEXT } from "../../lib/live";
import { parseExport, viewAfter } from "../../lib/replay";
import { ExportDownload } from "../ExportDownload";
import { DeleteSession } from "./DeleteSession";
import { ReplayDebrief } from "./ReplayDebrief";
import { ReplayStepper } from "./ReplayStepper";

export function ReplayViewer({ sessionId, accessKey }: { sessionId: string; accessKey: string }) {
  const [data, setData] = useState<SessionExport | null>(null);
  const [error, setError] = useState<string | null>(null);
  useEffect(() => {
    let live = true;
    if (!accessKey) return;
    void exportSession(sessionId, accessKey || undefined).then((r) => {
      if (!live) return;
      if (!r.ok) return setError(r.message);
      const parsed = parseExport(r.data);
      if (parsed.ok) setData(parsed.value);
      else setError(parsed.message);
    });
    return () => {
      live = false;
    };
  }, [sessionId, accessKey]);

  if (!accessKey) {
    return (
      <p className="notice error" data-testid="replay-error">
        This replay link has no key. Open it from the facilitator console or from the replays list.
      </p>
    );
  }
  if (error)
    return (
      <p className="notice error" data-testid="replay-error">
        Could not load this session: {error}
      </p>
    );
  if (!data) return <p className="muted">Loading the session log…</p>;
  if (data.events.length === 0) return <p className="notice">This session has no events.</p>;
  return <ReplayBody data={data} sessionId={sessionId} accessKey={accessKey} />;
}

function ReplayBody({
  data,
  sessionId,
  accessKey,
}: {
  data: SessionExport;
  sessionId: string;
  accessKey: string;
}) {
  const events = data.events;
  const finalView = useMemo(() => viewAfter(events, events.length), [events]);
  const names = finalView.ok ? seatNames(finalView.view) : [];
  const currency = finalView.ok ? (finalView.view.scenario.currency ?? null) : null;

  return (
    <div>
      <div className="row" style={{ justifyContent: "space-between" }}>
        <div>
          <h1 style={{ marginBottom: 0 }}>{data.session.title}</h1>
          <p className="muted small">
            {STATUS_TEXT[data.session.status]} · {data.session.rounds} round
            {data.session.rounds === 1 ? "" : "s"} played · created{" "}
            {formatDateTime(data.session.createdAt)}
          </p>
        </div>
        <div className="row no-print">
          <ExportDownload
            sessionId={sessionId}
            accessKey={accessKey}
            format="json"
            label="Download JSON"
            testId="download-json"
          />
          <ExportDownload
            sessionId={sessionId}
            accessKey={accessKey}
            format="csv"
            label="Download CSV"
            testId="download-csv"
          />
          <button type="button" onClick={() => window.print()} data-testid="print-debrief">
            Print debrief
          </button>
          <DeleteSession sessionId={sessionId} accessKey={accessKey} />
        </div>
      </div>
      <ReplayStepper events={events} names={names} currency={currency} />
      <ReplayDebrief
        data={data}
        finalView={finalView.ok ? finalView.view : null}
        names={names}
        currency={currency}
      />
    </div>
  );
}
