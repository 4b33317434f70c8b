/** Invented demo data: three bakeries bidding for a station kiosk lease. */
export const kiosk = {
  title: "Station kiosk lease",
  prize: 100,
  csf: { kind: "ratio", decisiveness: 1 },
  currency: "$",
  rivals: [
    { name: "North Bakery", cost: 1 },
    { name: "Corner Ovens", cost: 1.5 },
    { name: "Rye & Crumb", cost: 2, budget: 30 },
  ],
  leader: null,
};

export function clone<T>(x: T): T {
  return JSON.parse(JSON.stringify(x)) as T;
}
