/**
 * The errors a user can fix in their settings or a contributor in the rules
 * catalogue. Kept apart from the validation code (and zod), so the command
 * line can recognise them without loading it.
 */
export class ConfigError extends Error {}

export class CatalogueError extends Error {}
