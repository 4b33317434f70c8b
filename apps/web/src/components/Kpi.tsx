import type { ReactNode } from "react";

/** One labelled figure in a `.kpis` strip. */
export function Kpi({
  label,
  testId,
  children,
}: {
  label: ReactNode;
  testId?: string;
  children: ReactNode;
}) {
  return (
    <div className="kpi">
      <span className="label">{label}</span>
      <span className="value" data-testid={testId}>
        {children}
      </span>
    </div>
  );
}
