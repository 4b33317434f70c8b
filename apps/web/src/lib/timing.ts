/** Named UI delays, so every screen waits the same and a test can name what it waits for. */

/** How long a "Copied" confirmation stays on a copy button before it reads "Copy" again. */
export const COPIED_NOTICE_MS = 1_500;

/** How long typing must pause before the explorer recomputes (one solve per pause, not per key). */
export const RECOMPUTE_DEBOUNCE_MS = 300;
