/**
 * What a part symbol may do when clicked (flip a switch, press a button, edit a note). Passed through
 * a React context whose value never changes, so node components are not re-rendered by it.
 */
import { createContext, useContext } from 'react';

export interface PartActions {
  toggleSwitch(partId: string): void;
  pressButton(partId: string, pressed: boolean): void;
  editText(partId: string, text: string): void;
  relabel(partId: string, label: string): void;
  /** opens a module's inside on the canvas (double-click on an instance) */
  openModule(moduleId: string): void;
  /** true while the board is read-only for this user */
  readOnly(): boolean;
}

const noop: PartActions = {
  toggleSwitch: () => undefined,
  pressButton: () => undefined,
  editText: () => undefined,
  relabel: () => undefined,
  openModule: () => undefined,
  readOnly: () => true,
};

export const PartActionsContext = createContext<PartActions>(noop);

export function usePartActions(): PartActions {
  return useContext(PartActionsContext);
}
