import type { Metadata } from "next";
import { SeatView } from "../../../components/live/SeatView";

export const metadata: Metadata = { title: "Your seat" };

export default async function SeatPage({
  params,
  searchParams,
}: {
  params: Promise<{ id: string }>;
  searchParams: Promise<{ key?: string | string[] }>;
}) {
  const { id } = await params;
  const { key } = await searchParams;
  return <SeatView sessionId={id} seatKey={typeof key === "string" ? key : ""} />;
}
