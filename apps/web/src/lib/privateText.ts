/** Words for private numbers (docs/protocol.md R40-R44), shared by the seat, console and replay. */
import type { HiddenView, RoleView } from "@contend/protocol";

export type Range = HiddenView["entries"][number]["range"];

export function rangeText(r: Range, money: (v: number) => string): string {
  return r.dist === "uniform"
    ? `from ${money(r.low)} to ${money(r.high)}, any value equally likely`
    : `from ${money(r.low)} to ${money(r.high)}, most likely ${money(r.mode)}`;
}

export function truthOf(view: RoleView, seat: number, field: "cost" | "value"): number {
  const r = view.scenario.rivals[seat];
  if (!r) return NaN;
  return field === "cost" ? r.cost : (r.value ?? view.scenario.prize);
}

export const PRIVATE_FIELD_LABEL = {
  cost: "cost per unit of effort",
  value: "worth of the prize",
} as const;
