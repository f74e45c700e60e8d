import { Router } from 'express';
import { rateLimit } from 'express-rate-limit';
import { z } from 'zod';
import { AnalysisError, parseRowList } from '../../../shared/analysis';
import type { AnalyzeConfig } from '../../config';
import { analyzePending, prepareAnalysis, rowOf } from '../../services/analysis-table';
import type { AnalysisRunner } from '../../services/analysis-runner';
import { HttpError, badRequest, parseInput } from '../errors';
import { requireUser } from '../middleware/require-user';
import { streamAnalysis } from './analyze-stream';

/** A list of labels as a comma-separated string or an array. */
const LabelListSchema = z.union([
  z.string().transform((s) => s.split(',').map((x) => x.trim()).filter(Boolean)),
  z.array(z.string().min(1)),
]);

/** The optional analysis fields, from the query string or the body. */
export const AnalyzeOptionsSchema = z.object({
  inputs: LabelListSchema.optional(),
  outputs: LabelListSchema.optional(),
  select: LabelListSchema.optional(),
  // only the shape here: which rows are acceptable is the pipeline's one don't-care rule
  dontCares: z.union([
    z.array(z.number()),
    z.record(z.string(), z.array(z.number())),
    z.string(),
  ]).optional(),
});

/**
 * `POST /api/analyze`: a board file in (the body itself, or `{board, inputs?, select?, …}`), the
 * `analyze` JSON of CONTRACTS §2 out. Signed-in users only, `perMinute` analyses per account; the body
 * size limit of the JSON parser answers 413; a bad board 400 naming its ids in `fields`. Tables of up
 * to `inlineMaxInputs` inputs are computed in the request; larger ones in a worker thread (time limit:
 * 413 `analysis_too_large`; every worker busy: 503) and their rows streamed with backpressure.
 */
export function analyzeRouter(config: AnalyzeConfig, runner: AnalysisRunner): Router {
  const r = Router();
  // a million-row table keeps a core busy for a second or two: bound how often one account asks
  const limit = rateLimit({
    windowMs: 60_000, limit: config.perMinute, standardHeaders: 'draft-7', legacyHeaders: false, validate: { xForwardedForHeader: false },
    keyGenerator: (req) => `user:${String(req.session?.userId ?? 'none')}`,
    handler: (_req, _res, next) => next(new HttpError(429, 'too_many_attempts', 'Too many analyses in a minute; wait a moment and try again')),
  });
  r.post('/analyze', requireUser, limit, async (req, res) => {
    const body = (req.body ?? {}) as Record<string, unknown>;
    if (typeof body !== 'object' || Array.isArray(body)) throw badRequest('invalid_board', 'Send a board file as the JSON body', { _: 'not an object' });
    const raw = body.board && typeof body.board === 'object' ? body.board : body;
    const fromBody = { inputs: body.inputs, outputs: body.outputs, select: body.select, dontCares: body.dontCares };
    const q = req.query as Record<string, unknown>;
    const fromQuery = { inputs: q.inputs, outputs: q.outputs, select: q.select, dontCares: q.dontCares };
    const pick = (k: keyof typeof fromBody) => fromBody[k] ?? fromQuery[k];
    const opts = parseInput(AnalyzeOptionsSchema, { inputs: pick('inputs'), outputs: pick('outputs'), select: pick('select'), dontCares: pick('dontCares') });
    try {
      const dontCares = typeof opts.dontCares === 'string' ? parseRowList(opts.dontCares) : opts.dontCares;
      const analyzeReq = { ...opts, dontCares };
      const { board, inputCount } = prepareAnalysis(raw, analyzeReq);
      if (inputCount <= config.inlineMaxInputs) {
        const p = analyzePending(board, analyzeReq);
        const rows = Array.from({ length: p.rowCount }, (_, i) => rowOf(p, i));
        res.json({ inputs: p.inputs, outputs: p.outputs, sequential: p.sequential, rows, outputsInfo: p.outputsInfo, functionMap: p.functionMap });
        return;
      }
      const aborted = new AbortController();
      const onClose = () => { if (!res.writableFinished) aborted.abort(); };
      res.once('close', onClose);
      const p = await runner.run(board, analyzeReq, aborted.signal).finally(() => res.off('close', onClose));
      await streamAnalysis(res, p);
    } catch (err) {
      if (err instanceof AnalysisError) {
        const invalidBoard = !('inputs' in err.fields || 'outputs' in err.fields || 'select' in err.fields || 'dontCares' in err.fields);
        throw new HttpError(400, invalidBoard ? 'invalid_board' : 'invalid_input', err.message, err.fields);
      }
      throw err;
    }
  });
  return r;
}
