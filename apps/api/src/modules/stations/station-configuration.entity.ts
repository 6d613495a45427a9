import { Entity, PrimaryColumn } from 'typeorm';

/** A configuration of a source that can feed an end station (bench); staff edit the list. */
@Entity('station_configurations')
export class StationConfiguration {
  @PrimaryColumn({ name: 'station_id', type: 'uuid' }) stationId: string;
  @PrimaryColumn({ name: 'configuration_id', type: 'uuid' }) configurationId: string;
}
