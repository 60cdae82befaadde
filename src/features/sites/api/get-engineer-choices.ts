import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';

import { paths } from '@/config/paths';
import { api } from '@/lib/api-client';
import { personSchema, type Person } from '@/types/api';
import type { SiteRole } from '@/config/paths';

const membersSchema = z.object({ members: z.array(personSchema) });
const engineerHomeSchema = z.object({ colleagues: z.array(personSchema) });

const isEngineer = (person: Person) => person.roles.includes('engineer');

/**
 * The installer's engineers, to assign to a site or to filter the list by. The office may read
 * the whole membership; engineers cannot, so theirs comes from the colleagues on their home page.
 */
export async function getEngineerChoices(
  role: SiteRole,
  installerId: string,
  { signal }: { signal?: AbortSignal } = {},
): Promise<Person[]> {
  if (role === 'office') {
    const { members } = await api.get(
      `/api/organisations/${encodeURIComponent(installerId)}/members`,
      membersSchema,
      { signal },
    );
    return members.filter(isEngineer);
  }
  const { colleagues } = await api.get(paths.api.roleHome.getHref('engineer'), engineerHomeSchema, {
    signal,
  });
  return colleagues.filter(isEngineer);
}

export const getEngineerChoicesQueryOptions = (role: SiteRole, installerId: string) =>
  queryOptions({
    queryKey: ['organisations', installerId, 'engineers', role],
    queryFn: ({ signal }) => getEngineerChoices(role, installerId, { signal }),
  });

export const useEngineerChoices = (role: SiteRole, installerId: string | undefined) =>
  useQuery({
    ...getEngineerChoicesQueryOptions(role, installerId ?? ''),
    enabled: Boolean(installerId),
  });
