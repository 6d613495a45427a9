import { Column, Entity, PrimaryGeneratedColumn } from 'typeorm';

@Entity('changeover_pairs')
export class ChangeoverPair {
  @PrimaryGeneratedColumn('uuid') id: string;
  @Column({ name: 'instrument_id', type: 'uuid' }) instrumentId: string;
  @Column({ name: 'from_configuration_id', type: 'uuid' }) fromConfigurationId: string;
  @Column({ name: 'to_configuration_id', type: 'uuid' }) toConfigurationId: string;
  @Column({ name: 'base_minutes', type: 'integer' }) baseMinutes: number;
}
