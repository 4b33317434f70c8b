import { seriesColour } from "../../lib/palette";

/** A compared session's number beside a swatch of its line's colour. */
export function SessionNumber({ index }: { index: number }) {
  return (
    <>
      <span
        aria-hidden="true"
        style={{
          display: "inline-block",
          width: "0.9em",
          height: "0.9em",
          borderRadius: 2,
          background: seriesColour(index),
        }}
      />{" "}
      {index + 1}
    </>
  );
}
