/**
 * The simulator's flat view of a netlist: compressed rows (start offsets + entries) in typed arrays, so
 * that the event loop walks integers only.
 */
import { stateSize } from './parts';
import type { CompiledPart } from './types';

/** Typed-array layout of the parts, their pins and nets. */
export interface SimLayout {
  /** part i reads nets inNet[inStart[i] … inStart[i + 1]) */
  inStart: Int32Array;
  inNet: Int32Array;
  /** part i drives slots slotStart[i] … slotStart[i + 1]), slot s drives net slotNet[s] */
  slotStart: Int32Array;
  slotNet: Int32Array;
  slotPart: Int32Array;
  /** part i keeps its state from stateOff[i]; nState bytes in all */
  stateOff: Int32Array;
  nState: number;
  /** a net's single driver slot, −1 undriven, −2 conflict (two or more) */
  netDrivers: Int32Array;
  /** parts reading net n (each once): fanPart[fanStart[n] … fanStart[n + 1]) */
  fanStart: Int32Array;
  fanPart: Int32Array;
}

/** Builds the layout of compiled parts over nNets nets. */
export function buildLayout(parts: CompiledPart[], nNets: number): SimLayout {
  const n = parts.length;
  const inStart = new Int32Array(n + 1);
  const slotStart = new Int32Array(n + 1);
  const stateOff = new Int32Array(n);
  let nIn = 0, nSlots = 0, nState = 0;
  parts.forEach((p, i) => {
    inStart[i] = nIn; nIn += p.inputs.length;
    slotStart[i] = nSlots; nSlots += p.outputs.length;
    stateOff[i] = nState; nState += stateSize(p.kind);
  });
  inStart[n] = nIn;
  slotStart[n] = nSlots;
  const inNet = new Int32Array(nIn);
  const slotNet = new Int32Array(nSlots);
  const slotPart = new Int32Array(nSlots);
  parts.forEach((p, i) => {
    inNet.set(p.inputs, inStart[i]);
    p.outputs.forEach((net, k) => { slotNet[slotStart[i] + k] = net; slotPart[slotStart[i] + k] = i; });
  });
  const netDrivers = new Int32Array(nNets).fill(-1);
  for (let s = 0; s < nSlots; s++) {
    const net = slotNet[s];
    netDrivers[net] = netDrivers[net] === -1 ? s : -2;
  }
  // fan-out in two passes (count, then fill); lastPart skips a second pin of the same part on a net
  const fanStart = new Int32Array(nNets + 1);
  const lastPart = new Int32Array(nNets).fill(-1);
  for (let i = 0; i < n; i++) {
    for (let k = inStart[i]; k < inStart[i + 1]; k++) {
      const net = inNet[k];
      if (lastPart[net] !== i) { lastPart[net] = i; fanStart[net + 1]++; }
    }
  }
  for (let net = 0; net < nNets; net++) fanStart[net + 1] += fanStart[net];
  const fanPart = new Int32Array(fanStart[nNets]);
  const fill = fanStart.slice(0, nNets);
  lastPart.fill(-1);
  for (let i = 0; i < n; i++) {
    for (let k = inStart[i]; k < inStart[i + 1]; k++) {
      const net = inNet[k];
      if (lastPart[net] !== i) { lastPart[net] = i; fanPart[fill[net]++] = i; }
    }
  }
  return { inStart, inNet, slotStart, slotNet, slotPart, stateOff, nState, netDrivers, fanStart, fanPart };
}
