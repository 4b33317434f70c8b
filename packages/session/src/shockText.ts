/** A shock record in words, for CSV cells and summaries. */
import type { ShockRecord } from "@contend/protocol";

/** One shock as plain text: "prize 1000 -> 1500; Millstone Loaves cost 1.25 -> 1.5". */
export function shockText(s: ShockRecord): string {
  const parts: string[] = [];
  const nameOf = (i: number) => s.before.rivals[i]?.name ?? s.after.rivals[i]?.name ?? `seat ${i}`;
  const show = (v: unknown) => (v === null || v === undefined ? "default" : String(v));
  for (const c of s.changes) {
    if (c.target === "prize") parts.push(`prize ${s.before.prize} -> ${s.after.prize}`);
    else if (c.target === "csf")
      parts.push(`contest form ${JSON.stringify(s.before.csf)} -> ${JSON.stringify(s.after.csf)}`);
    else if (c.target === "rival") {
      const from = s.before.rivals[c.index]?.[c.field];
      const to = s.after.rivals[c.index]?.[c.field];
      parts.push(`${nameOf(c.index)} ${c.field} ${show(from)} -> ${show(to)}`);
    } else if (c.target === "add-rival") parts.push(`${c.rival.name} joins`);
    else parts.push(`${nameOf(c.index)} retired`);
  }
  return parts.join("; ");
}
