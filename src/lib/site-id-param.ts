import { useParams, type Params } from 'react-router-dom';

/**
 * The `:siteId` of the current route. Every route that uses this declares the parameter, so a
 * missing one means a broken link: answer 404 like any other unknown site.
 */
export function siteIdFrom(params: Params): string {
  const siteId = params.siteId;
  if (!siteId)
    throw new Response('No site in the address', { status: 404, statusText: 'Not Found' });
  return siteId;
}

export function useSiteIdParam(): string {
  return siteIdFrom(useParams());
}
