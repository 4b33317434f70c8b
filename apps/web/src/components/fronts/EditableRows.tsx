"use client";

import type { ComponentProps, ReactNode } from "react";
import { TextField } from "../Field";

/** A compact text input in a table cell (its label stays the accessible name). */
export function CellField(props: Omit<ComponentProps<typeof TextField>, "compact">) {
  return (
    <td>
      <TextField compact {...props} />
    </td>
  );
}

/**
 * The fronts explorer's editable tables (fronts; rivals): a fieldset with an explanation, one
 * row per item with a Remove button, and an Add button. Each table says what its cells are.
 */
export function EditableRows<T>({
  legend,
  intro,
  headers,
  items,
  cells,
  name,
  onRemove,
  onAdd,
  addLabel,
  testId,
  idPrefix,
  after,
}: {
  legend: string;
  /** explanation and controls above the table */
  intro: ReactNode;
  headers: ReactNode[];
  items: readonly T[];
  cells: (item: T, i: number) => ReactNode;
  /** the item's name for its Remove button */
  name: (item: T, i: number) => string;
  onRemove: (i: number) => void;
  onAdd: () => void;
  addLabel: string;
  testId: string;
  /** test ids are `${idPrefix}-${i}-remove` and `${idPrefix}-add` */
  idPrefix: string;
  /** shown under the table, above the Add button (problems of cells not on show) */
  after?: ReactNode;
}) {
  return (
    <fieldset>
      <legend>{legend}</legend>
      {intro}
      <div className="table-wrap">
        <table className="editor-table" data-testid={testId}>
          <thead>
            <tr>
              {headers.map((h, j) => (
                <th key={j} scope="col">
                  {h}
                </th>
              ))}
              <th scope="col">
                <span className="sr-only">Remove</span>
              </th>
            </tr>
          </thead>
          <tbody>
            {items.map((item, i) => (
              <tr key={i}>
                {cells(item, i)}
                <td>
                  <button
                    type="button"
                    onClick={() => onRemove(i)}
                    disabled={items.length <= 1}
                    aria-label={`Remove ${name(item, i)}`}
                    data-testid={`${idPrefix}-${i}-remove`}
                  >
                    Remove
                  </button>
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      {after}
      <button type="button" onClick={onAdd} data-testid={`${idPrefix}-add`}>
        {addLabel}
      </button>
    </fieldset>
  );
}
