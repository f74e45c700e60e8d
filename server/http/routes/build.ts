import { Router } from 'express';
import { z } from 'zod';
import { canonicalBoard, parseBoardFile } from '../../../shared/board';
import { BuildError, buildSheet, convertBoard } from '../../../shared/build';
import { badRequest, parseInput } from '../errors';
import { requireUser } from '../middleware/require-user';

const SettingsSchema = z.union([z.string(), z.record(z.string(), z.union([z.string(), z.number()]))]);
const BuildSheetOptionsSchema = z.object({ family: z.string().min(1).optional(), set: SettingsSchema.optional() });
const ConvertOptionsSchema = z.object({ to: z.enum(['nor', 'nand'], { message: 'to is nor or nand' }), complements: z.boolean().optional() });

/** The board file of a body that is either the board itself or `{board, …options}`; 400 naming the bad ids. */
function boardOf(body: unknown) {
  if (!body || typeof body !== 'object' || Array.isArray(body)) throw badRequest('invalid_board', 'Send a board file as the JSON body', { _: 'not an object' });
  const b = body as Record<string, unknown>;
  const raw = b.board && typeof b.board === 'object' ? b.board : b;
  const parsed = parseBoardFile(raw);
  if (!parsed.ok) {
    const fields = Object.fromEntries(parsed.problems.map((p) => [p.id ?? p.path, p.message]));
    throw badRequest('invalid_board', parsed.problems[0].message, fields);
  }
  return { board: parsed.board, options: b };
}

function asBadRequest(err: unknown): never {
  if (err instanceof BuildError) throw badRequest('invalid_input', err.message, err.fields);
  throw err;
}

/**
 * `POST /api/build-sheet` (`{board, family?, set?}` or the board itself, `?family=` too): the `build-sheet`
 * JSON of CONTRACTS §2. `POST /api/convert` (`{board, to, complements?}`): `{board, gates, inverters,
 * complementsUsed, partsBefore}`, the board NOR-only or NAND-only. Signed-in users; bad input is 400 with fields.
 */
export function buildRouter(): Router {
  const r = Router();
  r.post('/build-sheet', requireUser, (req, res) => {
    const { board, options } = boardOf(req.body);
    const q = req.query as Record<string, unknown>;
    const opts = parseInput(BuildSheetOptionsSchema, { family: options.family ?? q.family, set: options.set ?? q.set });
    try {
      res.json(buildSheet(board, opts.family ?? board.family, { set: opts.set }));
    } catch (err) {
      asBadRequest(err);
    }
  });
  r.post('/convert', requireUser, (req, res) => {
    const { board, options } = boardOf(req.body);
    const q = req.query as Record<string, unknown>;
    const opts = parseInput(ConvertOptionsSchema, { to: options.to ?? q.to, complements: options.complements });
    try {
      const result = convertBoard(board, opts.to, { complements: opts.complements });
      res.json({ ...result, board: canonicalBoard(result.board) });
    } catch (err) {
      asBadRequest(err);
    }
  });
  return r;
}
