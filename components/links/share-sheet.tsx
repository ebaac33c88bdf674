// "Share" for one sheet (owners): make a read-only viewer link, see its address once, list and revoke links.
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import type { SheetSummary } from '@/shared/api';
import type { ViewerLinkCreated, ViewerLinkSummary } from '@/shared/client/api-client';
import { loadable } from '@/shared/client/loadable';
import { useCreateViewerLink, useRevokeViewerLink, useViewerLinks } from '@/shared/client/queries';
import { space } from '../theme/tokens';
import { ConfirmDialog } from '../ui/confirm-dialog';
import { errorMessage } from '../ui/format';
import { FormSheet } from '../ui/form-sheet';
import { Loadable } from '../ui/loadable';
import { Text } from '../ui/text';
import { LinkForm } from './link-form';
import { LinkList } from './link-list';
import { NewLinkNotice } from './new-link-notice';

export function ShareSheet({ sheet, onClose }: { sheet: SheetSummary | null; onClose: () => void }) {
  return (
    <FormSheet visible={sheet !== null} title={sheet ? `Share “${sheet.name}”` : 'Share'} onClose={onClose} testID="share-sheet">
      {sheet ? <ShareBody key={sheet.id} sheetId={sheet.id} /> : null}
    </FormSheet>
  );
}

function ShareBody({ sheetId }: { sheetId: string }) {
  const links = useViewerLinks(sheetId);
  const create = useCreateViewerLink(sheetId);
  const revoke = useRevokeViewerLink(sheetId);
  const [made, setMade] = useState<ViewerLinkCreated | null>(null);
  const [revoking, setRevoking] = useState<ViewerLinkSummary | null>(null);
  const [revokeError, setRevokeError] = useState<string | null>(null);
  const closeRevoke = () => {
    setRevoking(null);
    setRevokeError(null);
  };

  return (
    <View style={styles.body}>
      <Text tone="muted">
        Anyone with a viewer link can look at this sheet without an account, and comment after giving a name. They cannot
        change it.
      </Text>
      {made ? (
        <NewLinkNotice url={made.url} onDone={() => setMade(null)} />
      ) : (
        <LinkForm
          onSubmit={async (body) => {
            setMade(await create.mutateAsync(body));
          }}
        />
      )}
      <Text variant="caption" tone="muted" style={styles.heading}>
        LINKS TO THIS SHEET
      </Text>
      <Loadable state={loadable(links)} loadingLabel="Loading links…" errorTitle="Could not load the links" testID="links">
        {(list) => <LinkList links={list} onRevoke={setRevoking} />}
      </Loadable>
      <ConfirmDialog
        visible={revoking !== null}
        title="Revoke this link?"
        message={`${revoking?.label ? `“${revoking.label}”` : 'The link'} stops working at once, also for anyone looking now. This cannot be undone.`}
        confirmLabel="Revoke link"
        danger
        busy={revoke.isPending}
        error={revokeError}
        onCancel={closeRevoke}
        onConfirm={() =>
          revoking && revoke.mutate(revoking.id, { onSuccess: closeRevoke, onError: (error) => setRevokeError(errorMessage(error)) })
        }
        testID="revoke-link-dialog"
      />
    </View>
  );
}

const styles = StyleSheet.create({
  body: { gap: space.lg, paddingBottom: space.md },
  heading: { letterSpacing: 0.8 },
});
