/**
 * Workshop templates of sessions with fronts (docs/protocol.md R45): the invented demo scenario
 * the solver ships (three coffee-roaster chains, four districts, one quarterly budget each; no
 * real firms) plus live-session settings.
 */
import roaster from "@contend/solver/scenarios/roaster-districts.json";
import type { FrontsSessionInput } from "./sessionTypes";

export interface FrontsTemplate {
  id: string;
  label: string;
  blurb: string;
  scenario: FrontsSessionInput;
}

export const FRONTS_TEMPLATES: readonly FrontsTemplate[] = [
  {
    id: "roaster-districts",
    label: "Coffee roasters over four districts",
    blurb:
      "Three roaster chains split one quarterly marketing budget over four city districts. Where to concentrate and where to concede is the decision; each district is its own contest.",
    scenario: {
      ...(roaster as FrontsSessionInput),
      session: {
        outcome: "shares",
        rounds: 4,
        clockSeconds: 180,
        missingMove: "repeat",
        computer: { "Bluebird Beanery": { kind: "equilibrium" } },
      },
    },
  },
];
