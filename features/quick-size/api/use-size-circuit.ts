'use client';

import { useMutation } from '@tanstack/react-query';

import { apiFetch } from '@/lib/api/client';
import type { CircuitInput, CircuitResult } from '@/lib/sizing';

/** POST /api/sizing: one circuit sized on the server with the same engine as the boards. */
export function useSizeCircuit() {
  return useMutation({
    mutationFn: (input: CircuitInput) =>
      apiFetch<{ result: CircuitResult }>('/api/sizing', { method: 'POST', body: input }).then((r) => r.result),
  });
}
