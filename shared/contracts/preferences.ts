import { z } from 'zod';
import { typeError } from './messages';

/**
 * A person's display preferences. Only what the screens show changes: the API takes and answers SI values
 * everywhere, and stored values stay SI.
 */
export const unitSystems = ['si', 'us-customary'] as const;
export const unitSystemSchema = z.enum(unitSystems, { error: typeError('must be "si" or "us-customary"') });
export type UnitSystem = z.infer<typeof unitSystemSchema>;

/** GET /api/me/preferences. */
export const preferencesSchema = z.object({ unitSystem: unitSystemSchema });
export type Preferences = z.infer<typeof preferencesSchema>;

/** PATCH /api/me/preferences: the fields to change. */
export const updatePreferencesSchema = z.strictObject({ unitSystem: unitSystemSchema.optional() });
export type UpdatePreferencesInput = z.infer<typeof updatePreferencesSchema>;
