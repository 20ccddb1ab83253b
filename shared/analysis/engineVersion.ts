/** Bumped whenever a change to the engine can change a stored figure; old captures can then be re-analysed. */
export const ENGINE_VERSION = 1;
