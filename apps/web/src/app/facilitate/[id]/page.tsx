import type { Metadata } from "next";
import { sessionPage } from "../../../components/sessionPage";

export const metadata: Metadata = { title: "Facilitator console" };

export default sessionPage("facilitate");
