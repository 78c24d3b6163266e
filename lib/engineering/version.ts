// Bump when any formula, default or preset changes, so stored results can be traced to the rules that produced them.
export const ENGINE_VERSION = "1.2.0";
