"use client";

import type { LibraryFilter } from "../../lib/libraryApi";
import { EMPTY_FILTER } from "../../lib/libraryApi";

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
        <label className="filter-field grow">
          <span className="small">Title contains</span>
          <input
            type="search"
            value={filter.q}
            placeholder="e.g. tender"
            maxLength={80}
            onChange={(e) => set("q", e.target.value)}
            data-testid="library-search"
          />
        </label>
        <label className="filter-field">
          <span className="small">Date</span>
          <select
            value={filter.dateOf}
            onChange={(e) => set("dateOf", e.target.value as LibraryFilter["dateOf"])}
            data-testid="library-date-of"
          >
            <option value="created">created</option>
            <option value="ended">ended</option>
          </select>
        </label>
        <label className="filter-field">
          <span className="small">from</span>
          <input
            type="date"
            value={filter.from}
            onChange={(e) => set("from", e.target.value)}
            data-testid="library-from"
          />
        </label>
        <label className="filter-field">
          <span className="small">to</span>
          <input
            type="date"
            value={filter.to}
            onChange={(e) => set("to", e.target.value)}
            data-testid="library-to"
          />
        </label>
        <label className="filter-field">
          <span className="small">Show</span>
          <select
            value={filter.archived}
            onChange={(e) => set("archived", e.target.value as LibraryFilter["archived"])}
            data-testid="library-archived"
          >
            <option value="hide">active sessions</option>
            <option value="only">archived only</option>
            <option value="all">active and archived</option>
          </select>
        </label>
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
