"use client";

import type { LibraryFilter } from "../../lib/libraryApi";
import { EMPTY_FILTER } from "../../lib/libraryApi";
import { FilterField, FilterSelect } from "../Field";

const DATE_OF: readonly { value: LibraryFilter["dateOf"]; label: string }[] = [
  { value: "created", label: "created" },
  { value: "ended", label: "ended" },
];

const ARCHIVED: readonly { value: LibraryFilter["archived"]; label: string }[] = [
  { value: "hide", label: "active sessions" },
  { value: "only", label: "archived only" },
  { value: "all", label: "active and archived" },
];

/** The library's search bar: title text, tag chips, a date range, archived or not. */
export function LibraryFilters({
  filter,
  setFilter,
  tags,
}: {
  filter: LibraryFilter;
  setFilter: (f: LibraryFilter) => void;
  /** every tag on the sessions listed, to pick one as a filter */
  tags: readonly string[];
}) {
  const set = <K extends keyof LibraryFilter>(k: K, v: LibraryFilter[K]) =>
    setFilter({ ...filter, [k]: v });
  const shownTags = filter.tag && !tags.includes(filter.tag) ? [filter.tag, ...tags] : tags;
  return (
    <div className="card library-filters no-print" role="search" aria-label="Search past sessions">
      <div className="row">
        <FilterField label="Title contains" grow>
          <input
            type="search"
            value={filter.q}
            placeholder="e.g. tender"
            maxLength={80}
            onChange={(e) => set("q", e.target.value)}
            data-testid="library-search"
          />
        </FilterField>
        <FilterSelect
          label="Date"
          value={filter.dateOf}
          options={DATE_OF}
          onChange={(v) => set("dateOf", v)}
          testId="library-date-of"
        />
        {(["from", "to"] as const).map((k) => (
          <FilterField key={k} label={k}>
            <input
              type="date"
              value={filter[k]}
              onChange={(e) => set(k, e.target.value)}
              data-testid={`library-${k}`}
            />
          </FilterField>
        ))}
        <FilterSelect
          label="Show"
          value={filter.archived}
          options={ARCHIVED}
          onChange={(v) => set("archived", v)}
          testId="library-archived"
        />
        <button
          type="button"
          className="small"
          onClick={() => setFilter(EMPTY_FILTER)}
          data-testid="library-clear"
        >
          Clear
        </button>
      </div>
      {shownTags.length > 0 && (
        <div className="tag-list" aria-label="Filter by tag">
          <span className="small muted">Tags:</span>
          {shownTags.map((t) => (
            <button
              key={t}
              type="button"
              className={`tag-chip${filter.tag === t ? " active" : ""}`}
              aria-pressed={filter.tag === t}
              onClick={() => set("tag", filter.tag === t ? "" : t)}
              data-testid={`library-tag-${t}`}
            >
              {t}
            </button>
          ))}
        </div>
      )}
    </div>
  );
}
