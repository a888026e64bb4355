/**
 * Version of the measurement engine. Stored with every analysis so a result can be
 * reproduced; bump the minor version when a change can move a reported figure.
 */
export const ENGINE_VERSION = '2.0.0'
