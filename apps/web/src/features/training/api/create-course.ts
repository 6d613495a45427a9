import type { CourseDto, CourseInput } from '@femtoslot/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { trainingKeys } from '../../../lib/query-keys';

export const createCourse = (input: CourseInput) => apiClient.post<{ course: CourseDto }>('/api/training/courses', input);

export function useCreateCourse() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: createCourse, onSuccess: async () => { await queryClient.invalidateQueries({ queryKey: trainingKeys.all }); } });
}
