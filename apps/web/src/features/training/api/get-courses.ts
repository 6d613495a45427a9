import type { ConfigurationRequirementsDto, CourseDto } from '@femtoslot/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { trainingKeys } from '../../../lib/query-keys';

export const getCourses = (signal?: AbortSignal) => apiClient.get<{ courses: CourseDto[] }>('/api/training/courses', signal).then((b) => b.courses);
export const getRequirements = (signal?: AbortSignal) =>
  apiClient.get<{ requirements: ConfigurationRequirementsDto[] }>('/api/training/requirements', signal).then((b) => b.requirements);

export const coursesQueryOptions = () => queryOptions({ queryKey: trainingKeys.courses(), queryFn: ({ signal }) => getCourses(signal) });
export const requirementsQueryOptions = () => queryOptions({ queryKey: trainingKeys.requirements(), queryFn: ({ signal }) => getRequirements(signal) });

export function useCourses() {
  return useQuery(coursesQueryOptions());
}

export function useRequirements() {
  return useQuery(requirementsQueryOptions());
}
