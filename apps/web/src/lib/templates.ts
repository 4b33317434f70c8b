/**
 * Invented workshop templates (no real firms). Each is a complete session scenario: the contest
 * file the CLI reads plus the live-session settings.
 */
import type { SessionScenarioInput } from "./sessionTypes";

export interface Template {
  id: string;
  label: string;
  blurb: string;
  scenario: SessionScenarioInput;
}

export const TEMPLATES: readonly Template[] = [
  {
    id: "kiosk-lease",
    label: "Station kiosk lease",
    blurb:
      "Three bakeries prepare offers for a kiosk lease at a busy station. Offers are costly to prepare; better prepared offers win a larger chance.",
    scenario: {
      title: "Three bakeries bid for the station kiosk lease",
      prize: 120000,
      currency: "EUR",
      csf: { kind: "ratio", decisiveness: 1 },
      rivals: [
        { name: "Larkspur Bakehouse", cost: 1 },
        { name: "Millstone Loaves", cost: 1.25 },
        { name: "Hearth Lane Bakery", cost: 1.6 },
      ],
      leader: null,
      session: {
        outcome: "winner",
        spendStep: 500,
        rounds: 4,
        clockSeconds: 120,
        missingMove: "zero",
        computer: { "Hearth Lane Bakery": { kind: "equilibrium" } },
      },
    },
  },
  {
    id: "shelf-space",
    label: "Shelf-space ad battle",
    blurb:
      "Two juice makers spend on in-store promotion for a retailer's chilled shelf. The incumbent's brand gives it a head start; shelf share follows spend.",
    scenario: {
      title: "Two juice makers fight for chilled shelf space",
      prize: 80000,
      currency: "USD",
      csf: { kind: "ratio", decisiveness: 0.8 },
      rivals: [
        { name: "Orchard Ridge Pressery", cost: 1, weight: 1.3 },
        { name: "Sunfield Squeeze", cost: 1, value: 65000 },
      ],
      leader: null,
      session: {
        outcome: "shares",
        spendStep: 1000,
        rounds: 5,
        clockSeconds: 90,
        missingMove: "repeat",
        computer: {},
      },
    },
  },
  {
    id: "bridge-tender",
    label: "Bridge-maintenance tender",
    blurb:
      "Four engineering firms prepare bids for a five-year bridge-maintenance contract. One firm wins the whole contract; bid preparation is sunk.",
    scenario: {
      title: "Four engineering firms prepare bids for a bridge-maintenance tender",
      prize: 500000,
      currency: "GBP",
      csf: { kind: "ratio", decisiveness: 1 },
      rivals: [
        { name: "Arden Structural", cost: 1, budget: 90000 },
        { name: "Kestrel Civil Partners", cost: 1.1 },
        { name: "Pennant Bridgeworks", cost: 1.3 },
        { name: "Greyfell Engineering", cost: 1.5, budget: 40000 },
      ],
      leader: null,
      session: {
        outcome: "winner",
        spendStep: 2500,
        rounds: 3,
        clockSeconds: 180,
        missingMove: "zero",
        computer: {
          "Pennant Bridgeworks": { kind: "best-reply" },
          "Greyfell Engineering": { kind: "overspender", factor: 1.5 },
        },
      },
    },
  },
];

export function templateById(id: string): Template | undefined {
  return TEMPLATES.find((t) => t.id === id);
}
