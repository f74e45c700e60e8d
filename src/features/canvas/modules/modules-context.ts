/**
 * The board's modules as the canvas needs them while drawing: the pins of each module's instances and
 * its title. Provided once by the canvas from the live document, read by the instance symbol.
 */
import { createContext, useContext } from 'react';
import type { ModulePins } from '../../../../shared/board';

export interface ModulesView {
  pins: ModulePins;
  titles: ReadonlyMap<string, string>;
}

export const EMPTY_MODULES: ModulesView = { pins: new Map(), titles: new Map() };

export const ModulesContext = createContext<ModulesView>(EMPTY_MODULES);

/** The modules of the board on the canvas. */
export function useModulesView(): ModulesView {
  return useContext(ModulesContext);
}
