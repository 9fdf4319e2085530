import { and, asc, eq } from "drizzle-orm";
import type { Db, Tx } from "../client";
import { flagNotes, type FlagNoteRow } from "../schema";

export async function flagNotesOf(db: Db | Tx, monthId: string, revision: number): Promise<FlagNoteRow[]> {
  return db
    .select()
    .from(flagNotes)
    .where(and(eq(flagNotes.monthId, monthId), eq(flagNotes.revision, revision)))
    .orderBy(asc(flagNotes.code), asc(flagNotes.stream));
}

/** Writes (or rewrites) the explanation of one flag of a month revision; returns the earlier text, if any. */
export async function saveFlagNote(tx: Tx, row: Omit<typeof flagNotes.$inferInsert, "id" | "writtenAt">): Promise<string | null> {
  const [old] = await tx
    .select({ text: flagNotes.text })
    .from(flagNotes)
    .where(and(eq(flagNotes.monthId, row.monthId), eq(flagNotes.revision, row.revision), eq(flagNotes.code, row.code), eq(flagNotes.stream, row.stream ?? "")));
  await tx
    .insert(flagNotes)
    .values(row)
    .onConflictDoUpdate({
      target: [flagNotes.monthId, flagNotes.revision, flagNotes.code, flagNotes.stream],
      set: { text: row.text, writtenBy: row.writtenBy, writtenByName: row.writtenByName, writtenRole: row.writtenRole, writtenAt: new Date() },
    });
  return old?.text ?? null;
}

/** Explanations keyed as the statement looks them up: `code|stream`. */
export const noteKey = (code: string, stream: string | undefined | null) => `${code}|${stream ?? ""}`;
