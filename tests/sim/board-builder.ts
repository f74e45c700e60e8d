/** Builds board files in code for the simulator tests (parts are laid out on a simple grid). */
import { BoardFileSchema, type BoardFile, type FamilyId } from '../../shared/board';

type PartInput = { id: string; kind: string; [field: string]: unknown };

/** Collects parts and wires, then validates them into a BoardFile. */
export class BoardBuilder {
  private parts: PartInput[] = [];
  private wires: { id: string; from: string; to: string }[] = [];

  constructor(private readonly family: FamilyId = 'ideal', private readonly title = 'Test board') {}

  /** Adds a part (any §1 fields). */
  part(p: PartInput): this {
    this.parts.push({ x: (this.parts.length % 10) * 80, y: Math.floor(this.parts.length / 10) * 80, ...p });
    return this;
  }

  /** Adds a wire between two `part.pin` refs. */
  wire(from: string, to: string): this {
    this.wires.push({ id: `w${this.wires.length + 1}`, from, to });
    return this;
  }

  /** A gate whose inputs are wired from the given `part.pin` refs. */
  gate(id: string, kind: string, from: string[]): this {
    this.part(kind === 'not' || kind === 'buffer' ? { id, kind } : { id, kind, inputs: from.length });
    from.forEach((ref, i) => this.wire(ref, `${id}.in${i}`));
    return this;
  }

  switch(id: string, label = id.toUpperCase(), on = false): this {
    return this.part({ id, kind: 'switch', label, on });
  }

  /** A constant 1 part with id `one`. */
  const1(): this {
    return this.part({ id: 'one', kind: 'const', label: 'ONE', value: 1 });
  }

  lamp(id: string, label: string, from: string): this {
    this.part({ id, kind: 'lamp', label });
    return this.wire(from, `${id}.in`);
  }

  board(): BoardFile {
    return BoardFileSchema.parse({ format: 'gatefold-board', version: 1, title: this.title, family: this.family, parts: this.parts, wires: this.wires });
  }
}
