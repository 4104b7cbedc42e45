import { and, eq } from 'drizzle-orm'
import { HOTWASH_SECTIONS, type HotwashSection } from '#shared/review/plan'
import type { HotwashNote } from '#shared/review/types'

/** Every hotwash section of an exercise, empty ones included (revision 0). */
export function hotwashNotes(exerciseId: string): HotwashNote[] {
  const rows = useDB().select({
    section: schema.hotwashNotes.section, body: schema.hotwashNotes.body, revision: schema.hotwashNotes.revision,
    updatedAt: schema.hotwashNotes.updatedAt, updatedBy: schema.users.name,
  }).from(schema.hotwashNotes).leftJoin(schema.users, eq(schema.users.id, schema.hotwashNotes.updatedBy))
    .where(eq(schema.hotwashNotes.exerciseId, exerciseId)).all()
  return HOTWASH_SECTIONS.map((s) => {
    const r = rows.find(x => x.section === s.key)
    return {
      key: s.key,
      title: s.title,
      hint: s.hint,
      body: r?.body ?? '',
      revision: r?.revision ?? 0,
      updatedAt: r?.updatedAt.toISOString() ?? null,
      updatedBy: r?.updatedBy ?? null,
    }
  })
}

/**
 * Saves one hotwash section. `revision` is the one the writer started from: when someone saved in
 * between, 409 with the current text so that nothing is overwritten unseen.
 */
export function saveHotwash(exerciseId: string, section: HotwashSection, input: { body: string; revision: number }, actorId: string) {
  const db = useDB()
  const saved = db.transaction((tx) => {
    const row = tx.select().from(schema.hotwashNotes).where(and(
      eq(schema.hotwashNotes.exerciseId, exerciseId),
      eq(schema.hotwashNotes.section, section),
    )).get()
    const current = row?.revision ?? 0
    if (current !== input.revision) {
      throw conflict(
        'Someone saved this section after you opened it. Their text is shown; merge your changes and save again.',
        { body: row?.body ?? '', revision: current },
      )
    }
    if (row) return tx.update(schema.hotwashNotes).set({
      body: input.body,
      revision: current + 1,
      updatedBy: actorId,
    }).where(eq(schema.hotwashNotes.id, row.id)).returning().get()
    return tx.insert(schema.hotwashNotes).values({
      exerciseId,
      section,
      body: input.body,
      revision: 1,
      updatedBy: actorId,
    }).returning().get()
  })
  audit(actorId, 'review.hotwash.save', exerciseId, { section, revision: saved.revision })
  return hotwashNotes(exerciseId).find(s => s.key === section)!
}
