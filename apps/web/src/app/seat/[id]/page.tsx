import type { Metadata } from "next";
import { sessionPage } from "../../../components/sessionPage";

export const metadata: Metadata = { title: "Your seat" };

export default sessionPage("seat");
