import type { CSSProperties, ReactNode } from "react";

export interface HeadCell {
  key: string;
  label: ReactNode;
  /** right-aligned numbers */
  num: boolean;
}

/** A text column's header. */
export function textCol(label: string): HeadCell {
  return { key: label, label, num: false };
}

/** A number column's header (right-aligned); `key` is needed when the label is not text. */
export function numCol(label: ReactNode, key = String(label)): HeadCell {
  return { key, label, num: true };
}

/**
 * A table of figures: optional caption, one header row, the body rows the caller renders.
 * Wrapped in a scrolling `.table-wrap` unless `wrap` is null.
 */
export function FigureTable({
  head,
  caption,
  testId,
  wrap = "table-wrap",
  wrapStyle,
  children,
}: {
  head: readonly HeadCell[];
  caption?: ReactNode;
  testId?: string;
  /** class of the wrapping div, or null for none */
  wrap?: string | null;
  wrapStyle?: CSSProperties;
  children: ReactNode;
}) {
  const table = (
    <table data-testid={testId}>
      {caption ? (
        <caption className="small muted" style={{ textAlign: "left" }}>
          {caption}
        </caption>
      ) : null}
      <thead>
        <tr>
          {head.map((h) => (
            <th key={h.key} scope="col" className={h.num ? "num" : undefined}>
              {h.label}
            </th>
          ))}
        </tr>
      </thead>
      <tbody>{children}</tbody>
    </table>
  );
  if (wrap === null) return table;
  return (
    // Focusable, so a keyboard can scroll a table wider than a phone (WCAG 2.1.1).
    <div
      className={wrap}
      style={wrapStyle}
      tabIndex={0}
      role="region"
      aria-label={typeof caption === "string" ? caption : "Table"}
    >
      {table}
    </div>
  );
}

/** The first cell of a body row, naming what the row is about. */
export function RowHeader({ children }: { children: ReactNode }) {
  return (
    <th scope="row" style={{ background: "transparent", fontWeight: 500 }}>
      {children}
    </th>
  );
}
