import type { FamilyId } from '../board';
import { familyOf, type Level } from '../sim';

/** What a reader of an undriven net sees in this family (as the simulator decides it). */
export function familyFloating(family: FamilyId): Level {
  return familyOf(family).floating;
}
