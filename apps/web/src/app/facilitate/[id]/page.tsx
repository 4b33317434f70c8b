import type { Metadata } from "next";
import { FacilitatorConsole } from "../../../components/live/FacilitatorConsole";

export const metadata: Metadata = { title: "Facilitator console" };

export default async function FacilitatePage({
  params,
  searchParams,
}: {
  params: Promise<{ id: string }>;
  searchParams: Promise<{ key?: string | string[] }>;
}) {
  const { id } = await params;
  const { key } = await searchParams;
  return <FacilitatorConsole sessionId={id} facilitatorKey={typeof key === "string" ? key : ""} />;
}
