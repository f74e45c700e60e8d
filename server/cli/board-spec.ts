/**
 * The board file's shape as `conform` reads it, derived from BoardFileSchema. Run from source (tsx,
 * Vitest) it is derived on import; scripts/build-cli.mjs derives it once at build time and puts the
 * result in the bundle in place of this module, so a call loads neither zod nor the schemas. Null when the
 * schema uses something `describeSchema` does not model: then every file goes through zod.
 */
import { BoardFileSchema } from '../../shared/board';
import { describeSchema, UnsupportedSchema, type Shape } from './shape';

function derive(): Shape | null {
  try {
    return describeSchema(BoardFileSchema);
  } catch (err) {
    if (err instanceof UnsupportedSchema) return null;
    throw err;
  }
}

export const BOARD_SHAPE: Shape | null = derive();
