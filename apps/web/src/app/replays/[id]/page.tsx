import type { Metadata } from "next";
import { ReplayViewer } from "../../../components/replay/ReplayViewer";
import { sessionPage } from "../../../components/sessionPage";

export const metadata: Metadata = { title: "Replay and debrief" };

export default sessionPage((id, key) => <ReplayViewer sessionId={id} accessKey={key} />);
