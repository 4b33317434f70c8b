import type { ReactNode } from "react";
import { KeyedPage } from "./KeyedPage";
import type { KeyedRoute } from "./KeyedPage";

export interface SessionPageProps {
  params: Promise<{ id: string }>;
}

/**
 * A `/<route>/[id]#key=` page. The key is in the fragment, so the server never sees it: the
 * page is rendered without it and the browser reads it (KeyedPage).
 */
export function sessionPage(route: KeyedRoute) {
  return async function SessionPage({ params }: SessionPageProps): Promise<ReactNode> {
    const { id } = await params;
    return <KeyedPage route={route} sessionId={id} />;
  };
}
