import { FAMILY_IDS, type FamilyId } from '../../shared/board';

/** How each logic family is named in menus (the ids are the contract's). */
export const FAMILY_LABELS: Record<FamilyId, string> = {
  ideal: 'Ideal gates',
  'tube-drl-nor': 'Vacuum tube, diode-resistor NOR',
  relay: 'Relay logic',
  rtl: 'RTL (resistor-transistor)',
  dtl: 'DTL (diode-transistor)',
  'ttl-74ls': 'TTL 74LS',
  'cmos-4000b': 'CMOS 4000B',
  'cmos-74hc': 'CMOS 74HC',
};

export const FAMILY_OPTIONS = FAMILY_IDS.map((id) => ({ value: id, label: FAMILY_LABELS[id] }));

/**
 * Families whose real build can hurt someone: tube gates run on high-tension rails, and relay
 * racks are often fed from mains supplies. Low-voltage logic gets no caution.
 */
export function safetyCautionFor(family: FamilyId): string | null {
  switch (family) {
    case 'tube-drl-nor':
      return 'tube circuits carry voltages that can kill, even after switch-off. Follow your local electrical codes; leave high-voltage and mains wiring to qualified people.';
    case 'relay':
      return 'relay supplies are often mains-powered. Follow your local electrical codes; leave mains wiring to qualified people.';
    case 'ideal':
    case 'rtl':
    case 'dtl':
    case 'ttl-74ls':
    case 'cmos-4000b':
    case 'cmos-74hc':
      return null;
    default: {
      const unknownFamily: never = family;
      return unknownFamily;
    }
  }
}
