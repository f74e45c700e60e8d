import { z } from 'zod';
import { MAX_GATE_INPUTS, MIN_GATE_INPUTS } from './kinds';
import { LABEL_MAX_LENGTH } from './labels';

const common = {
  id: z.string().min(1, 'part id is empty').max(64),
  x: z.number().finite().default(0),
  y: z.number().finite().default(0),
  rotation: z.union([z.literal(0), z.literal(90), z.literal(180), z.literal(270)]).optional(),
  label: z.string().max(LABEL_MAX_LENGTH).optional(),
};
const storageInit = { init: z.union([z.literal(0), z.literal(1)]).optional() };
const gateInputs = { inputs: z.number().int().min(MIN_GATE_INPUTS).max(MAX_GATE_INPUTS).default(2) };

export const PartSchema = z.discriminatedUnion('kind', [
  z.object({ ...common, kind: z.literal('switch'), on: z.boolean().default(false) }),
  z.object({ ...common, kind: z.literal('button'), pressed: z.boolean().default(false), bounce: z.boolean().optional() }),
  z.object({ ...common, kind: z.literal('clock'), period: z.number().positive().optional() }),
  z.object({ ...common, kind: z.literal('const'), value: z.union([z.literal(0), z.literal(1)]) }),
  z.object({ ...common, kind: z.literal('lamp') }),
  z.object({ ...common, kind: z.literal('probe') }),
  z.object({ ...common, kind: z.literal('buffer') }),
  z.object({ ...common, kind: z.literal('not') }),
  z.object({ ...common, kind: z.literal('and'), ...gateInputs }),
  z.object({ ...common, kind: z.literal('or'), ...gateInputs }),
  z.object({ ...common, kind: z.literal('nand'), ...gateInputs }),
  z.object({ ...common, kind: z.literal('nor'), ...gateInputs }),
  z.object({ ...common, kind: z.literal('xor'), ...gateInputs }),
  z.object({ ...common, kind: z.literal('xnor'), ...gateInputs }),
  z.object({ ...common, kind: z.literal('srlatch'), ...storageInit }),
  z.object({ ...common, kind: z.literal('dlatch'), ...storageInit }),
  z.object({ ...common, kind: z.literal('dff'), ...storageInit }),
  z.object({ ...common, kind: z.literal('mux2') }),
  z.object({ ...common, kind: z.literal('mux4') }),
  z.object({ ...common, kind: z.literal('note'), text: z.string().max(4000).default('') }),
  // only inside a module (docs/decisions/004-modules.md): `in` drives the inside, `out` reads it
  z.object({ ...common, kind: z.literal('port'), dir: z.enum(['in', 'out']) }),
  // an instance of the board's module `module`; its pins are that module's port labels
  z.object({ ...common, kind: z.literal('module'), module: z.string().min(1).max(64) }),
]);
export type Part = z.infer<typeof PartSchema>;

export const WireSchema = z.object({
  id: z.string().min(1).max(64),
  from: z.string().min(3).max(140),
  to: z.string().min(3).max(140),
});
export type Wire = z.infer<typeof WireSchema>;

export const FAMILY_IDS = ['ideal', 'tube-drl-nor', 'relay', 'rtl', 'dtl', 'ttl-74ls', 'cmos-4000b', 'cmos-74hc'] as const;
export const FamilySchema = z.enum(FAMILY_IDS);
export type FamilyId = z.infer<typeof FamilySchema>;

/** Where a module was copied from: a team-library entry and its version. */
export const ModuleOriginSchema = z.object({
  library: z.string().min(1).max(64),
  version: z.number().int().min(1),
});
export type ModuleOrigin = z.infer<typeof ModuleOriginSchema>;

/** A module (CONTRACTS §1): a circuit whose `port` parts are the pins of its instances. */
export const ModuleSchema = z.object({
  id: z.string().min(1, 'module id is empty').max(64),
  title: z.string().max(200).default(''),
  parts: z.array(PartSchema).max(20000),
  wires: z.array(WireSchema).max(50000),
  origin: ModuleOriginSchema.optional(),
});
export type Module = z.infer<typeof ModuleSchema>;

export const BoardFileSchema = z.object({
  format: z.literal('gatefold-board'),
  version: z.literal(1),
  title: z.string().max(200).default('Untitled board'),
  family: FamilySchema.default('ideal'),
  parts: z.array(PartSchema).max(20000),
  wires: z.array(WireSchema).max(50000),
  /** present only when the board has modules, so a flat board's file is unchanged */
  modules: z.array(ModuleSchema).max(500).optional(),
});
export type BoardFile = z.infer<typeof BoardFileSchema>;
/** A piece of a board (what the clipboard holds). */
export const FragmentSchema = z.object({
  format: z.literal('gatefold-fragment'),
  parts: z.array(PartSchema),
  wires: z.array(WireSchema),
  /** modules used by the fragment's instances (and the modules they use) */
  modules: z.array(ModuleSchema).optional(),
});
export type Fragment = z.infer<typeof FragmentSchema>;
