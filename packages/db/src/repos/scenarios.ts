import { randomUUID } from "node:crypto";
import type { Db } from "../types";
import { json } from "./rows";

export interface ScenarioSummary {
  id: string;
  title: string;
  createdAt: Date;
}

export interface ScenarioRecord extends ScenarioSummary {
  body: unknown;
}

export function scenariosRepository(db: Db) {
  return {
    /** Saves a new scenario, or replaces the one with this id. */
    async save(input: { id?: string; title: string; body: unknown }): Promise<ScenarioRecord> {
      const id = input.id ?? randomUUID();
      const data = { title: input.title, body: json(input.body) };
      return db.scenario.upsert({ where: { id }, create: { id, ...data }, update: data });
    },

    async list(): Promise<ScenarioSummary[]> {
      return db.scenario.findMany({
        select: { id: true, title: true, createdAt: true },
        orderBy: { createdAt: "desc" },
      });
    },

    async get(id: string): Promise<ScenarioRecord | null> {
      return db.scenario.findUnique({ where: { id } });
    },
  };
}
