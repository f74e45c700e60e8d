import type { BoardRole } from '../../shared/api';
import type { FamilyId } from '../../shared/board';
import type { Services } from '../services';

/** Fills a freshly created demo board's document with parts and wires (written by the collaboration feature). */
export interface BoardContentSeeder {
  seed(boardId: number, slug: DemoBoardSlug, ownerId: number): Promise<void>;
}

/** What the seed needs from the app context. */
export interface SeedContext {
  services: Services;
  boardContent?: BoardContentSeeder;
}

/** Published demo password (README) for every demo account. */
export const DEMO_PASSWORD = 'gatefold-demo';

export const DEMO_USERS = [
  { key: 'mara', name: 'Mara Quinn', email: 'mara@larkspur.example', admin: true },
  { key: 'theo', name: 'Theo Vance', email: 'theo@larkspur.example', admin: false },
  { key: 'ines', name: 'Ines Okafor', email: 'ines@larkspur.example', admin: false },
  { key: 'calder', name: 'Ruth Calder', email: 'calder@room14.example', admin: false },
  { key: 'sam', name: 'Sam Ortiz', email: 'sam@room14.example', admin: false },
  { key: 'priya', name: 'Priya Nair', email: 'priya@room14.example', admin: false },
] as const;

type DemoUserKey = (typeof DEMO_USERS)[number]['key'];
export type DemoBoardSlug = 'half-adder' | 'mux-logic-unit' | 'debounced-clock' | 'ripple-counter-4bit' | 'tube-logic-unit' | 'one-bit-processor';

interface DemoBoard {
  slug: DemoBoardSlug;
  title: string;
  family: FamilyId;
  owner: DemoUserKey;
  members: Array<[DemoUserKey, Exclude<BoardRole, 'owner'>]>;
}

// The Larkspur Street Makerspace builds in vacuum-tube diode-resistor logic; Room 14 builds on 74LS TTL.
export const DEMO_BOARDS: DemoBoard[] = [
  { slug: 'half-adder', title: 'Half adder', family: 'tube-drl-nor', owner: 'theo', members: [['ines', 'editor']] },
  { slug: 'mux-logic-unit', title: 'Mux logic unit', family: 'tube-drl-nor', owner: 'ines', members: [['theo', 'editor'], ['calder', 'viewer']] },
  { slug: 'debounced-clock', title: 'Debounced clock', family: 'tube-drl-nor', owner: 'theo', members: [['ines', 'editor']] },
  { slug: 'tube-logic-unit', title: 'Tube logic unit', family: 'tube-drl-nor', owner: 'mara', members: [['theo', 'editor'], ['ines', 'editor']] },
  { slug: 'one-bit-processor', title: '1-bit processor', family: 'tube-drl-nor', owner: 'mara', members: [['theo', 'editor'], ['ines', 'viewer']] },
  { slug: 'ripple-counter-4bit', title: '4-bit ripple counter', family: 'ttl-74ls', owner: 'calder', members: [['sam', 'viewer'], ['priya', 'viewer']] },
];

/**
 * Each demo board's history: named snapshots of its earlier stages, oldest first (a stage lists the
 * part ids it had; the last stage without a list is the board as it is now). A board without an entry has no history.
 */
export const DEMO_HISTORY: Partial<Record<DemoBoardSlug, Array<{ name: string; parts?: string[] }>>> = {
  'half-adder': [{ name: 'Inputs and the sum gate', parts: ['a', 'b', 'g1', 's'] }, { name: 'Carry added' }],
  'mux-logic-unit': [{ name: 'Four gate functions side by side', parts: ['a', 'b', 'g_and', 'g_or', 'g_xor', 'g_not'] }, { name: 'Multiplexer picks the function' }],
  'debounced-clock': [
    { name: 'Raw push button on a lamp', parts: ['push', 'raw'] },
    { name: 'NAND latch cleans the press', parts: ['push', 'g_rb', 'g_sb', 'g_q', 'g_qn', 'raw', 'clean'] },
    { name: 'Flip-flops count the clean presses' },
  ],
  'tube-logic-unit': [{ name: 'Three NOR gates: NOR, AND and XOR of A and B', parts: ['a', 'b', 'g_nor', 'g_and', 'g_xor', 'n', 'd', 'x'] }, { name: 'Result register of NOR gates' }],
  'ripple-counter-4bit': [{ name: 'One stage: a single flip-flop', parts: ['clk', 'ff0', 'q0'] }, { name: 'All four stages' }],
};

/**
 * Creates the demo accounts and boards on an empty database. Board content comes from
 * `ctx.boardContent`, when the collaboration feature provides it.
 */
export async function seedDemo(ctx: SeedContext): Promise<{ users: Record<DemoUserKey, number>; boards: Record<DemoBoardSlug, number> }> {
  const users = {} as Record<DemoUserKey, number>;
  for (const u of DEMO_USERS) {
    const user = await ctx.services.auth.signUp({ email: u.email, name: u.name, password: DEMO_PASSWORD }, { isAdmin: u.admin });
    users[u.key] = user.id;
  }
  const boards = {} as Record<DemoBoardSlug, number>;
  for (const b of DEMO_BOARDS) {
    const ownerId = users[b.owner];
    const board = await ctx.services.boards.create(ownerId, { title: b.title, family: b.family });
    for (const [who, role] of b.members) await ctx.services.members.addDirect(board.id, users[who], role);
    boards[b.slug] = board.id;
    await ctx.boardContent?.seed(board.id, b.slug, ownerId);
  }
  return { users, boards };
}
