/** Bumped whenever a change to the engine can change a stored figure; old captures can then be re-analysed. 2: three-phase systems and voltage events. */
export const ENGINE_VERSION = 2;
