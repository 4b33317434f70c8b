import type { Metadata } from "next";
import { sessionPage } from "../../../components/sessionPage";

export const metadata: Metadata = { title: "Big screen" };

export default sessionPage("screen");
