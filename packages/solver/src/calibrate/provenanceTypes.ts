/**
 * The shape of a scenario's `provenance` (a summary of its calibration), apart from its
 * validator (provenance.ts) so that the scenario types can name it without an import cycle.
 */
export interface ProvenanceEstimate {
  estimate: number;
  low: number;
  high: number;
}

export interface ProvenanceRivalEstimate extends ProvenanceEstimate {
  rival: string;
}

export interface CalibrationProvenance {
  kind: "calibration";
  /** what the data were (a file name or a short label) */
  source: string;
  /** r with its 95% interval */
  decisiveness: ProvenanceEstimate;
  /** a_i / a_1 with 95% intervals */
  headStarts: ProvenanceRivalEstimate[];
  /** money, median over periods with a bootstrap 90% interval */
  revealedValues: ProvenanceRivalEstimate[];
  fit: { r2: number; rmse: number; observations: number; periods: number; dropped: number };
  bootstrap: { seed: number; resamples: number };
}

export type Provenance = CalibrationProvenance;
