/** Version of the simulation engine; every trace, result and score carries it. Bump on any change
 * that can alter a trace (the server re-runs attempts with the version they were scored with). */
export const ENGINE_VERSION = "1.0.0";
