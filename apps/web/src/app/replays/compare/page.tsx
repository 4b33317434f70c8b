import type { Metadata } from "next";
import { CompareSessions } from "../../../components/compare/CompareSessions";

export const metadata: Metadata = { title: "Compare sessions" };

export default function ComparePage() {
  return <CompareSessions />;
}
