import { queryOptions } from '@tanstack/react-query';
import { devMailListSchema } from '../../../../shared/contracts';
import { apiRequest } from '../../../lib/api-client';

/** Mails caught by the local fake mail server (development and test only), newest first. */
export const devMailQueryOptions = () =>
  queryOptions({
    queryKey: ['dev', 'mail'],
    queryFn: ({ signal }) => apiRequest('/api/dev/mail', { schema: devMailListSchema, signal }),
    select: (data) => data.mails,
    refetchInterval: 5_000,
  });
