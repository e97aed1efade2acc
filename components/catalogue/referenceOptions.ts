'use client';
/** The keys a reference column may name (a conductor's metal, a build's conductor and layers), for the grid's and the form's pickers. */
import { useMemo } from 'react';
import { useQuery } from '@tanstack/react-query';
import type { CatalogueKind } from '@/lib/catalogue/schemas';
import { catalogueQueryKey, fetchCatalogue } from './api';

export function useReferenceOptions(kind: CatalogueKind, enabled: boolean): Partial<Record<CatalogueKind, string[]>> {
  const needs = kind === 'conductors' ? ['materials'] : kind === 'builds' ? ['conductors', 'coverings'] : [];
  const materials = useQuery({ queryKey: catalogueQueryKey('materials'), queryFn: () => fetchCatalogue('materials'), enabled: enabled && needs.includes('materials') });
  const conductors = useQuery({ queryKey: catalogueQueryKey('conductors'), queryFn: () => fetchCatalogue('conductors'), enabled: enabled && needs.includes('conductors') });
  const coverings = useQuery({ queryKey: catalogueQueryKey('coverings'), queryFn: () => fetchCatalogue('coverings'), enabled: enabled && needs.includes('coverings') });
  return useMemo(
    () => ({
      materials: materials.data?.map((m) => m.key),
      conductors: conductors.data?.filter((c) => c.shape === 'round').map((c) => c.key),
      coverings: coverings.data?.map((c) => c.key),
    }),
    [materials.data, conductors.data, coverings.data],
  );
}
