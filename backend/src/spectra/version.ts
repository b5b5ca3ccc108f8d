/** Stable identifier of the engine's behaviour; stored with every scan so results can be traced. */
export const ENGINE_VERSION = 'redward-engine/0.6.10';
