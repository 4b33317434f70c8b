import type { Metadata } from "next";
import { ReplayList } from "../../components/replay/ReplayList";

export const metadata: Metadata = { title: "Replays" };

export default function ReplaysPage() {
  return <ReplayList />;
}
