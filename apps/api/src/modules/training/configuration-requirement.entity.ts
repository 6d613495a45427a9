import { Check, Column, Entity, PrimaryGeneratedColumn } from 'typeorm';

/** What a configuration asks of the person booking it: a course, or a sign-off described by its label. */
@Entity('configuration_requirements')
@Check('configuration_requirements_one_kind', '(course_id IS NULL) <> (signoff_label IS NULL)')
export class ConfigurationRequirement {
  @PrimaryGeneratedColumn('uuid') id: string;
  @Column({ name: 'configuration_id', type: 'uuid' }) configurationId: string;
  @Column({ name: 'course_id', type: 'uuid', nullable: true }) courseId: string | null;
  @Column({ name: 'signoff_label', type: 'text', nullable: true }) signoffLabel: string | null;
}
