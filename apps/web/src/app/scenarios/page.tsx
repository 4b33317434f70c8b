import type { Metadata } from "next";
import { ScenarioLibrary } from "../../components/replay/ScenarioLibrary";

export const metadata: Metadata = { title: "Saved scenarios" };

export default function ScenariosPage() {
  return <ScenarioLibrary />;
}
