import type { Metadata } from "next";
import { SeatView } from "../../../components/live/SeatView";
import { sessionPage } from "../../../components/sessionPage";

export const metadata: Metadata = { title: "Your seat" };

export default sessionPage((id, key) => <SeatView sessionId={id} seatKey={key} />);
