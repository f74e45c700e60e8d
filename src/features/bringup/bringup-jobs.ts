/**
 * The bring-up worker's work, free of worker plumbing so tests drive it directly: one job at a time,
 * the newest wins. A job works out the board's test vectors (kept for the board's logic, so a new
 * record or a moved part costs nothing), then ranks the suspects of the record (the diagnosis is
 * prepared once per board and vectors, then run per record). A job that a newer one replaces is dropped
 * before it starts or between its two stages; the page ignores the messages of any job but its newest.
 */
import { BringupError, prepareDiagnosis, testVectors, type DiagnoseResult, type Observation, type TestVectorsResult } from '../../../shared/bringup';
import { bringupKey, type BringupJob, type FromWorker, type ToWorker } from './protocol';

interface Vectors {
  key: string;
  result: TestVectorsResult | null;
  error: string | null;
  /** the prepared diagnosis of this board with these vectors (null: the board has nothing to read) */
  diagnose?: ((observed: Observation[]) => DiagnoseResult) | null;
}

/** Runs `fn` later, after messages already waiting (a timer in the worker; tests may pass their own). */
export type Defer = (fn: () => void) => void;

export class BringupJobs {
  /** the newest job not started yet */
  private waiting: BringupJob | null = null;
  /** the job between its vectors and its diagnosis */
  private running: BringupJob | null = null;
  private scheduled = false;
  private last: Vectors | null = null;

  constructor(private readonly post: (msg: FromWorker) => void, private readonly defer: Defer = (fn) => setTimeout(fn, 0)) {}

  handle(msg: ToWorker): void {
    switch (msg.type) {
      case 'run':
        if (this.waiting) this.post({ type: 'cancelled', id: this.waiting.id });
        this.waiting = msg;
        this.schedule();
        return;
      case 'cancel':
        if (this.waiting?.id === msg.id) {
          this.waiting = null;
          this.post({ type: 'cancelled', id: msg.id });
        } else if (this.running?.id === msg.id) {
          this.running = null;
          this.post({ type: 'cancelled', id: msg.id });
        }
        return;
      default: {
        const never: never = msg;
        throw new Error(`unknown message ${JSON.stringify(never)}`);
      }
    }
  }

  private schedule(): void {
    if (this.scheduled) return;
    this.scheduled = true;
    this.defer(() => {
      this.scheduled = false;
      this.step();
    });
  }

  /** One stage of work: a waiting job replaces the running one (which is told it was dropped). */
  private step(): void {
    if (this.waiting) {
      if (this.running) this.post({ type: 'cancelled', id: this.running.id });
      const job = this.waiting;
      this.waiting = null;
      this.running = null;
      if (!this.vectors(job)) return;
      this.running = job;
      this.schedule(); // the diagnosis after any message that came meanwhile
      return;
    }
    const job = this.running;
    this.running = null;
    if (job) this.diagnosis(job);
  }

  /** Posts the job's vectors; false when the job ends here (no vectors, or a failure). */
  private vectors(job: BringupJob): boolean {
    const key = bringupKey(job.board);
    try {
      if (this.last?.key !== key) {
        this.post({ type: 'working', id: job.id, stage: 'vectors' });
        this.last = null;
        try {
          this.last = { key, result: testVectors(job.board), error: null };
        } catch (err) {
          if (!(err instanceof BringupError)) throw err;
          this.last = { key, result: null, error: err.message };
        }
      }
    } catch (err) {
      this.post({ type: 'error', id: job.id, message: err instanceof Error ? err.message : String(err) });
      return false;
    }
    const { result, error } = this.last;
    this.post({ type: 'vectors', id: job.id, key, result, error });
    if (!result) this.post({ type: 'diagnosis', id: job.id, result: null });
    return result !== null;
  }

  /** Posts the diagnosis of the job's record (the observations that fit the vectors). */
  private diagnosis(job: BringupJob): void {
    const vectors = this.last;
    const result = vectors?.result;
    if (!vectors || !result) return;
    const usable = job.observed.filter((o) => o.in.length === result.inputs.length && o.out.length === result.outputs.length);
    if (!usable.length) {
      this.post({ type: 'diagnosis', id: job.id, result: null });
      return;
    }
    this.post({ type: 'working', id: job.id, stage: 'diagnosis' });
    try {
      if (vectors.diagnose === undefined) {
        try {
          vectors.diagnose = prepareDiagnosis(job.board, { vectors: result.vectors.map((v) => v.in) });
        } catch (err) {
          if (!(err instanceof BringupError)) throw err;
          vectors.diagnose = null;
        }
      }
      let diagnosis: DiagnoseResult | null = null;
      try {
        diagnosis = vectors.diagnose ? vectors.diagnose(usable.map((o) => ({ in: o.in, out: o.out }))) : null;
      } catch (err) {
        if (!(err instanceof BringupError)) throw err;
      }
      this.post({ type: 'diagnosis', id: job.id, result: diagnosis });
    } catch (err) {
      this.post({ type: 'error', id: job.id, message: err instanceof Error ? err.message : String(err) });
    }
  }
}
