import { infiniteQueryOptions, queryOptions } from "@tanstack/react-query";
import type { AccountEventView } from "./account-events";
import { fetchJson, searchString } from "./fetch-json";
import type { StationView, UserView } from "./schemas/people";

export interface UserFilters {
  role?: string;
  status?: string;
  station?: string;
  licence?: string;
  q?: string;
}

export interface UsersAnswer {
  users: UserView[];
  stations: StationView[];
}

export const usersQuery = (filters: UserFilters) =>
  queryOptions({
    queryKey: ["users", filters],
    queryFn: () => fetchJson<UsersAnswer>(`/api/users${searchString({ ...filters })}`),
  });

export interface AccountEventFilters {
  kind?: string;
  user?: string;
  q?: string;
  from?: string;
  to?: string;
}

export interface AccountEventsAnswer {
  events: AccountEventView[];
  nextBefore: number | null;
}

export const accountEventsQuery = (filters: AccountEventFilters) =>
  infiniteQueryOptions({
    queryKey: ["account-events", filters],
    queryFn: ({ pageParam }) => fetchJson<AccountEventsAnswer>(`/api/account-events${searchString({ ...filters, before: pageParam, limit: 50 })}`),
    initialPageParam: null as number | null,
    getNextPageParam: (last) => last.nextBefore,
  });
