import type { Metadata } from "next";
import { ReplayViewer } from "../../../components/replay/ReplayViewer";

export const metadata: Metadata = { title: "Replay and debrief" };

export default async function ReplayPage({
  params,
  searchParams,
}: {
  params: Promise<{ id: string }>;
  searchParams: Promise<{ key?: string | string[] }>;
}) {
  const { id } = await params;
  const { key } = await searchParams;
  return <ReplayViewer sessionId={id} accessKey={typeof key === "string" ? key : ""} />;
}
