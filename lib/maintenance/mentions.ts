/*
 * @mentions in work-order comments. A mention is "@" followed by a person's e-mail address, the
 * part of it before the "@", or their first name — matched without case or accents, so
 * "@tomas" finds Tomás on a phone keyboard without the accent.
 */

export type Mentionable = { id: string; email: string; name: string | null };

const fold = (s: string) => s.normalize("NFD").replace(/\p{M}/gu, "").toLowerCase();

/** Ids of the people mentioned in `body`, each once, in order of first mention. */
export function parseMentions(body: string, people: readonly Mentionable[]): string[] {
  const out: string[] = [];
  for (const m of body.matchAll(/(?:^|[^\w@])@([\p{L}\p{N}._+-]+(?:@[\w.-]+)?)/gu)) {
    const token = fold(m[1].replace(/[.]+$/, ""));
    const who = people.find((p) => {
      const email = p.email.toLowerCase();
      const first = p.name ? fold(p.name.split(/\s+/)[0]) : null;
      return token === email || token === email.split("@")[0] || token === first;
    });
    if (who && !out.includes(who.id)) out.push(who.id);
  }
  return out;
}
