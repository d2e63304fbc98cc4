import { z } from 'zod';

// The upload form's `columns` field; the mapping itself and the header guess are in column-mapping.ts.

const column = z
  .string({ error: 'Pick a column.' })
  .trim()
  .min(1, 'Pick a column.')
  .max(200, 'Column names are at most 200 characters.');

/** The zod schema of a mapping, as the upload form sends it in its `columns` field (JSON). */
export const columnMappingSchema = z.strictObject({
  time: z.strictObject({ column, unit: z.enum(['s', 'ms'], { error: 'Time is in s or ms.' }) }),
  pressure: z.strictObject({ column, unit: z.enum(['Pa', 'hPa'], { error: 'Pressure is in Pa or hPa.' }) }),
  temperature: z.strictObject({ column, unit: z.literal('C', { error: 'Temperature is in C.' }) }).optional(),
  acceleration: z
    .strictObject({
      columns: z
        .array(column)
        .min(1, 'Pick one acceleration column or three.')
        .max(3, 'Pick one acceleration column or three.')
        .refine((c) => c.length !== 2, 'Pick one acceleration column or three.'),
      unit: z.enum(['g', 'm/s2'], { error: 'Acceleration is in g or m/s2.' }),
    })
    .optional(),
});
