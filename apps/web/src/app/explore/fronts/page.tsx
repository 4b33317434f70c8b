import type { Metadata } from "next";
import { FrontsExplorer } from "../../../components/fronts/FrontsExplorer";

export const metadata: Metadata = { title: "Several fronts, one budget" };

export default function FrontsPage() {
  return <FrontsExplorer />;
}
