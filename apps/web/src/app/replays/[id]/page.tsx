import type { Metadata } from "next";
import { sessionPage } from "../../../components/sessionPage";

export const metadata: Metadata = { title: "Replay and debrief" };

export default sessionPage("replays");
