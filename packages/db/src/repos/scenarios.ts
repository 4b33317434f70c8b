import { randomUUID } from "node:crypto";
import type { Db } from "../types";
import { jsonb } from "./rows";

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
      await db.$executeRaw`INSERT INTO "Scenario" ("id", "title", "body")
        VALUES (${id}, ${input.title}, ${jsonb(input.body)})
        ON CONFLICT ("id") DO UPDATE SET "title" = EXCLUDED."title", "body" = EXCLUDED."body"`;
      const saved = await db.scenario.findUnique({ where: { id } });
      if (!saved) throw new Error(`scenario ${id} vanished right after it was saved`);
      return saved;
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
