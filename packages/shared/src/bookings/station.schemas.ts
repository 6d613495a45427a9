import { z } from 'zod';

/** PUT /api/stations/:id/configurations: the configurations that can feed the station (replaces the list). */
export const stationConfigurationsInputSchema = z.object({
  configurationIds: z.array(z.uuid({ message: 'Must be an id' })).max(200).refine((ids) => new Set(ids).size === ids.length, { message: 'Each configuration once' }),
});

/** An end station (a bench a source booking can include) and the configurations that can feed it. */
export interface StationDto {
  id: string;
  name: string;
  description: string;
  configurationIds: string[];
}
