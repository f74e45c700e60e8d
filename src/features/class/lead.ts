/**
 * Lead / follow through awareness. A leader (an editor or the owner) adds to its awareness state
 * `lead: {viewport: {x, y, zoom, w?, h?}, spotlight?: partIds, explain?: {row, step}}`; the room server fans
 * editors' states out to everyone, viewers' and guests' included, so every follower reads it. An editor
 * who follows adds `follow: <leader's client id>` (viewers' states stay on the server, so they are
 * counted through the server's audience entry instead). Reading is a pure function.
 */
import { z } from 'zod';

export const LeadSchema = z.object({
  viewport: z.object({ x: z.number(), y: z.number(), zoom: z.number().positive(), w: z.number().positive().optional(), h: z.number().positive().optional() }),
  spotlight: z.array(z.string()).max(500).optional(),
  explain: z.object({ row: z.number().int().min(0), step: z.number().int().min(0) }).nullable().optional(),
});
export type Lead = z.infer<typeof LeadSchema>;

export interface Leader {
  clientId: number;
  name: string;
  lead: Lead;
}

const StateSchema = z.object({
  user: z.object({ name: z.string() }).optional(),
  lead: LeadSchema.nullable().optional(),
  follow: z.number().nullable().optional(),
});

/** The one leader others follow: of the states with a valid `lead`, the lowest client id (not this one). */
export function readLeader(states: ReadonlyMap<number, unknown>, localClientId: number): Leader | null {
  let best: Leader | null = null;
  for (const [clientId, raw] of states) {
    if (clientId === localClientId) continue;
    const s = StateSchema.safeParse(raw);
    if (!s.success || !s.data.lead) continue;
    if (!best || clientId < best.clientId) best = { clientId, name: s.data.user?.name ?? 'someone', lead: s.data.lead };
  }
  return best;
}

/** Editors whose state says they follow `leaderId` (viewers are not among the states: see the audience). */
export function editorsFollowing(states: ReadonlyMap<number, unknown>, leaderId: number): number {
  let n = 0;
  for (const [clientId, raw] of states) {
    if (clientId === leaderId) continue;
    const s = StateSchema.safeParse(raw);
    if (s.success && s.data.follow === leaderId) n++;
  }
  return n;
}
