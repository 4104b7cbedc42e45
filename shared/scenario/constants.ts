/** The value of `format` in every scenario file of this version. */
export const SCENARIO_FORMAT = 'brinkwater-scenario/1'

/** Inject kinds every scenario may use; a scenario may declare more in `injectKinds`. */
export const BUILT_IN_INJECT_KINDS = ['briefing', 'data-release', 'media-query', 'decision-request', 'message'] as const

/** Days after impact that injects may still fall in when `clock.aftermathDays` is absent. */
export const DEFAULT_AFTERMATH_DAYS = 14

/** Largest scenario file accepted, bytes (UTF-8). */
export const MAX_SCENARIO_BYTES = 1024 * 1024

/** Largest number of YAML alias expansions accepted (guards against alias bombs). */
export const MAX_YAML_ALIASES = 100
