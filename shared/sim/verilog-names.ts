/** Identifier rules of IEEE Std 1364 for the Verilog export: sanitising, keywords, uniqueness. */

/** Reserved words of IEEE Std 1364-2005 that a label or id could collide with. */
const KEYWORDS = new Set(('always and assign automatic begin buf bufif0 bufif1 case casex casez cell cmos config deassign default ' +
  'defparam design disable edge else end endcase endconfig endfunction endgenerate endmodule endprimitive endspecify endtable ' +
  'endtask event for force forever fork function generate genvar highz0 highz1 if ifnone incdir include initial inout input ' +
  'instance integer join large liblist library localparam macromodule medium module nand negedge nmos nor noshowcancelled not ' +
  'notif0 notif1 or output parameter pmos posedge primitive pull0 pull1 pulldown pullup pulsestyle_onevent pulsestyle_ondetect ' +
  'rcmos real realtime reg release repeat rnmos rpmos rtran rtranif0 rtranif1 scalared showcancelled signed small specify ' +
  'specparam strong0 strong1 supply0 supply1 table task time tran tranif0 tranif1 tri tri0 tri1 triand trior trireg unsigned ' +
  'use uwire vectored wait wand weak0 weak1 while wire wor xnor xor').split(' '));

const SIMPLE = /^[A-Za-z_][A-Za-z0-9_$]*$/;

/**
 * Hands out unique identifiers. A user's label that is a legal identifier keeps its name; a keyword
 * becomes an escaped identifier (IEEE Std 1364-2005 §3.7.1: a backslash, the characters, then white
 * space — `\begin `), so no label ever takes a name from another label. Generated names (nets,
 * instances, registers) come after the labels and give way to them.
 */
export class VerilogNames {
  /** identifiers in use; an escaped identifier counts by its characters (`\cpu3 ` is `cpu3`) */
  private readonly used = new Set<string>();

  /** The port name of a label: the label itself, escaped when it is a keyword, else as take(). */
  label(label: string): string {
    if (!SIMPLE.test(label) || this.used.has(label)) return this.take(label, 'p_');
    this.used.add(label);
    return KEYWORDS.has(label) ? `\\${label} ` : label;
  }

  /** A unique identifier made from `raw`: other characters become `_`, keywords and leading digits get a prefix. */
  take(raw: string, prefix = 'n_'): string {
    let base = raw.replace(/[^A-Za-z0-9_]/g, '_');
    if (!/^[A-Za-z_]/.test(base) || KEYWORDS.has(base)) base = prefix + base;
    let name = base;
    for (let k = 2; this.used.has(name); k++) name = `${base}_${k}`;
    this.used.add(name);
    return name;
  }
}
