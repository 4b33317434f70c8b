import type { Metadata } from "next";
import { FacilitatorConsole } from "../../../components/live/FacilitatorConsole";
import { sessionPage } from "../../../components/sessionPage";

export const metadata: Metadata = { title: "Facilitator console" };

export default sessionPage((id, key) => <FacilitatorConsole sessionId={id} facilitatorKey={key} />);
