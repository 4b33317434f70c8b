"use client";

import { useSyncExternalStore } from "react";
import { keyFromFragment } from "../lib/keyring";
import { BigScreen } from "./live/BigScreen";
import { FacilitatorConsole } from "./live/FacilitatorConsole";
import { SeatView } from "./live/SeatView";
import { ReplayViewer } from "./replay/ReplayViewer";

export type KeyedRoute = "facilitate" | "seat" | "screen" | "replays";

function subscribe(onChange: () => void) {
  window.addEventListener("hashchange", onChange);
  return () => window.removeEventListener("hashchange", onChange);
}

/** The page's key from its URL fragment; null while rendering on the server (it has none). */
export function useFragmentKey(): string | null {
  return useSyncExternalStore(
    subscribe,
    () => keyFromFragment(window.location.hash),
    () => null,
  );
}

/** The session page of a route, given the key the browser read from the fragment. */
export function KeyedPage({ route, sessionId }: { route: KeyedRoute; sessionId: string }) {
  const key = useFragmentKey();
  if (key === null) return <p className="muted">Opening…</p>;
  switch (route) {
    case "facilitate":
      return <FacilitatorConsole sessionId={sessionId} facilitatorKey={key} />;
    case "seat":
      return <SeatView sessionId={sessionId} seatKey={key} />;
    case "screen":
      return <BigScreen sessionId={sessionId} spectatorKey={key} />;
    case "replays":
      return <ReplayViewer sessionId={sessionId} accessKey={key} />;
  }
}
