import type { Metadata } from "next";
import { BigScreen } from "../../../components/live/BigScreen";

export const metadata: Metadata = { title: "Big screen" };

export default async function ScreenPage({
  params,
  searchParams,
}: {
  params: Promise<{ id: string }>;
  searchParams: Promise<{ key?: string | string[] }>;
}) {
  const { id } = await params;
  const { key } = await searchParams;
  return <BigScreen sessionId={id} spectatorKey={typeof key === "string" ? key : ""} />;
}
