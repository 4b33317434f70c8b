import type { ReactNode } from "react";

export interface SessionPageProps {
  params: Promise<{ id: string }>;
  searchParams: Promise<{ key?: string | string[] }>;
}

/** A `/<route>/[id]?key=` page: the session id and its key (empty when absent or repeated). */
export function sessionPage(render: (sessionId: string, key: string) => ReactNode) {
  return async function SessionPage({ params, searchParams }: SessionPageProps) {
    const { id } = await params;
    const { key } = await searchParams;
    return render(id, typeof key === "string" ? key : "");
  };
}
