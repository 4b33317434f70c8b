/** Invented scenarios for the tests (no real firms). */
export function printShops(session: Record<string, unknown> = {}) {
  return {
    title: "Three print shops bid for the library poster contract",
    prize: 100,
    currency: "EUR",
    csf: { kind: "ratio", decisiveness: 1 },
    rivals: [
      { name: "Inkwell Press", cost: 1 },
      { name: "Foxglove Prints", cost: 1.25 },
      { name: "Cobble Copy", cost: 1.6 },
    ],
    leader: null,
    session: {
      outcome: "shares",
      effortStep: 0.25,
      rounds: 3,
      clockSeconds: null,
      missingMove: "zero",
      computer: {},
      ...session,
    },
  };
}
