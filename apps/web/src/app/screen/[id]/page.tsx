import type { Metadata } from "next";
import { BigScreen } from "../../../components/live/BigScreen";
import { sessionPage } from "../../../components/sessionPage";

export const metadata: Metadata = { title: "Big screen" };

export default sessionPage((id, key) => <BigScreen sessionId={id} spectatorKey={key} />);
