import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { render } from '@testing-library/react';

import { LiveSizing, sizingKey } from '@/features/board-editor/hooks/use-live-sizing';
import { useBoardDraftStore } from '@/features/board-editor/stores/board-draft-store';
import type { BoardResult } from '@/lib/sizing';

/**
 * Renders part of the editor as the editor mounts it: in a query cache, inside the live sizing
 * of the open draft (not sending anything), with `sized` as the sizing of the draft as it is.
 */
export function renderEditorPart(ui: React.ReactElement, sized?: BoardResult) {
  const client = new QueryClient({ defaultOptions: { queries: { retry: false }, mutations: { retry: false } } });
  const { boardId, editSeq } = useBoardDraftStore.getState();
  if (sized) client.setQueryData(sizingKey(boardId ?? '', editSeq), { editSeq, result: sized });
  return render(
    <QueryClientProvider client={client}>
      <LiveSizing boardId={boardId ?? ''} enabled={false}>
        {ui}
      </LiveSizing>
    </QueryClientProvider>,
  );
}
