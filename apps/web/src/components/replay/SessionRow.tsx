"use client";

import Link from "next/link";
import { useState } from "react";
import type { SessionListItem, SessionPatch } from "@contend/protocol";
import { tagProblem } from "@contend/protocol";
import { deleteSession, keyedPath } from "../../lib/api";
import { formatDateTime } from "../../lib/format";
import { forgetFacilitatorKey } from "../../lib/keyring";
import { editSession } from "../../lib/libraryApi";
import { STATUS_TEXT } from "../../lib/live";
import { ConfirmDelete } from "./ConfirmDelete";

/**
 * One past session in the library: its replay link, inline rename, tags (add, remove, click to
 * filter), archive and delete (with a confirmation). Every change goes through the server with
 * the key the row was listed with (this session's facilitator key, or the operator key).
 */
export function SessionRow({
  item,
  accessKey,
  onChanged,
  onDeleted,
  onTag,
}: {
  item: SessionListItem;
  accessKey: string;
  onChanged: (item: SessionListItem) => void;
  onDeleted: (id: string) => void;
  onTag: (tag: string) => void;
}) {
  const [renaming, setRenaming] = useState(false);
  const [title, setTitle] = useState(item.title);
  const [newTag, setNewTag] = useState("");
  const [confirming, setConfirming] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const tid = (what: string) => `session-${what}-${item.id}`;

  async function change(patch: SessionPatch): Promise<boolean> {
    setBusy(true);
    setError(null);
    const r = await editSession(item.id, accessKey, patch);
    setBusy(false);
    if (!r.ok) {
      setError(r.message);
      return false;
    }
    onChanged(r.data);
    return true;
  }

  async function addTag() {
    const typed = newTag.split(",").filter((t) => t.trim() !== "");
    const problem = typed.map(tagProblem).find((p) => p !== null);
    if (typed.length === 0 || problem) return setError(`Tag: ${problem ?? "type a tag first"}`);
    if (await change({ addTags: typed })) setNewTag("");
  }

  async function remove() {
    setBusy(true);
    const r = await deleteSession(item.id, accessKey);
    setBusy(false);
    if (!r.ok) return setError(`Not deleted: ${r.message}`);
    forgetFacilitatorKey(item.id);
    onDeleted(item.id);
  }

  return (
    <tr data-testid={tid("row")} className={item.archivedAt ? "archived-row" : undefined}>
      <td>
        {renaming ? (
          <form
            className="inline-edit"
            onSubmit={(e) => {
              e.preventDefault();
              void change({ title }).then((ok) => ok && setRenaming(false));
            }}
          >
            <input
              type="text"
              aria-label="New title"
              value={title}
              maxLength={80}
              onChange={(e) => setTitle(e.target.value)}
              data-testid={tid("title-input")}
              autoFocus
            />
            <button type="submit" className="small primary" disabled={busy}>
              Save
            </button>
            <button
              type="button"
              className="small"
              onClick={() => {
                setTitle(item.title);
                setRenaming(false);
              }}
            >
              Cancel
            </button>
          </form>
        ) : (
          <>
            <Link
              href={keyedPath("replays", item.id, accessKey)}
              data-testid={`replay-link-${item.id}`}
            >
              {item.title}
            </Link>{" "}
            <button
              type="button"
              className="link-button small"
              onClick={() => setRenaming(true)}
              aria-label={`Rename ${item.title}`}
              data-testid={tid("rename")}
            >
              Rename
            </button>
          </>
        )}
        {item.archivedAt && <span className="tag-chip muted"> archived</span>}
        <div className="tag-list">
          {item.tags.map((t) => (
            <span key={t} className="tag-chip" data-testid={tid(`tag-${t}`)}>
              <button
                type="button"
                className="link-button"
                onClick={() => onTag(t)}
                title={`Show sessions tagged ${t}`}
              >
                {t}
              </button>
              <button
                type="button"
                className="link-button tag-remove"
                aria-label={`Remove tag ${t}`}
                disabled={busy}
                onClick={() => void change({ removeTags: [t] })}
              >
                ×
              </button>
            </span>
          ))}
          <form
            className="inline-edit"
            onSubmit={(e) => {
              e.preventDefault();
              void addTag();
            }}
          >
            <input
              type="text"
              className="tag-input"
              aria-label={`Add a tag to ${item.title}`}
              placeholder="add tag"
              value={newTag}
              maxLength={66}
              onChange={(e) => setNewTag(e.target.value)}
              data-testid={tid("tag-input")}
            />
            <button type="submit" className="small" disabled={busy} data-testid={tid("tag-add")}>
              Add
            </button>
          </form>
        </div>
        {error && (
          <p className="field-error" role="alert" data-testid={tid("error")}>
            {error}
          </p>
        )}
      </td>
      <td data-label="Status">{STATUS_TEXT[item.status]}</td>
      <td className="num" data-label="Rounds played">
        {item.rounds}
      </td>
      <td data-label="Created">
        {formatDateTime(item.createdAt)}
        {item.endedAt && <div className="small muted">ended {formatDateTime(item.endedAt)}</div>}
      </td>
      <td className="actions">
        <button
          type="button"
          className="small"
          disabled={busy}
          onClick={() => void change({ archived: !item.archivedAt })}
          data-testid={tid(item.archivedAt ? "unarchive" : "archive")}
        >
          {item.archivedAt ? "Unarchive" : "Archive"}
        </button>
        <ConfirmDelete
          confirming={confirming}
          question="Delete for good? Its log, seats and links are erased."
          onAsk={() => setConfirming(true)}
          onDelete={() => void remove()}
          onKeep={() => setConfirming(false)}
          busy={busy}
          testIds={{ ask: tid("delete"), confirm: tid("delete-confirm") }}
        />
      </td>
    </tr>
  );
}
