// One pin's thread: what it is on, the first comment, the replies, attachments as thumbnails (photos) or file
// chips (CSV, PDF), a reply box, and resolve or reopen for those allowed to.
import { Image, Linking, Pressable, StyleSheet, View } from 'react-native';
import type { PinThread as Thread } from '@/shared/client/api-client';
import { radius, space } from '../theme/tokens';
import { useTheme } from '../theme/use-theme';
import { Button } from '../ui/button';
import { formatDateTime } from '../ui/format';
import { Icon } from '../ui/icon';
import { FormMessage } from '../ui/states';
import { Text } from '../ui/text';
import { NoteBox } from './note-box';
import { PinFlag } from './pin-flag';

export interface PinThreadProps {
  pin: Thread;
  /** "on Load A" or "on the sheet". */
  place: string;
  canWrite: boolean;
  canResolve: boolean;
  attachmentUrl: (attachmentId: string) => string;
  replying: boolean;
  resolving: boolean;
  attaching: boolean;
  attachError: string | null;
  onReply: (text: string) => Promise<unknown>;
  onResolve: (resolved: boolean) => void;
  onAttach: () => void;
  onBack: () => void;
}

export function PinThreadView(p: PinThreadProps) {
  const { color } = useTheme();
  const { pin } = p;
  const resolved = pin.resolvedAt !== null;
  return (
    <View style={styles.thread} testID={`pin-thread-${pin.number}`}>
      <View style={styles.head}>
        <PinFlag number={pin.number} resolved={resolved} open={false} />
        <View style={styles.grow}>
          <Text variant="bodyStrong">
            Pin {pin.number} {p.place}
          </Text>
          <Text variant="caption" tone="muted" testID="pin-thread-state">
            {resolved ? `Resolved ${formatDateTime(pin.resolvedAt)}` : 'Open'}
          </Text>
        </View>
        <Button label="All pins" variant="quiet" compact onPress={p.onBack} testID="pin-thread-back" />
      </View>

      <Note author={pin.author.name} at={pin.createdAt} body={pin.body} testID="pin-thread-body" />
      {pin.replies.map((r) => (
        <Note key={r.id} author={r.author.name} at={r.createdAt} body={r.body} testID={`pin-reply-${r.id}`} indent />
      ))}

      {pin.attachments.length ? (
        <View style={styles.files} testID="pin-attachments">
          {pin.attachments.map((a) => {
            const url = p.attachmentUrl(a.id);
            const isImage = a.mediaType.startsWith('image/');
            return (
              <Pressable
                key={a.id}
                onPress={() => void Linking.openURL(url)}
                accessibilityRole="link"
                accessibilityLabel={`Open ${a.fileName}`}
                testID={`pin-attachment-${a.fileName}`}
                style={[styles.file, { borderColor: color.line, backgroundColor: color.raised }]}
              >
                {isImage ? (
                  <Image source={{ uri: url }} style={styles.thumb} resizeMode="cover" accessibilityIgnoresInvertColors />
                ) : (
                  <View style={[styles.thumb, styles.fileIcon]}>
                    <Icon name="file-text" size={26} color={color.inkMuted} />
                    <Text variant="caption" tone="muted">
                      {a.mediaType === 'application/pdf' ? 'PDF' : 'CSV'}
                    </Text>
                  </View>
                )}
                <Text variant="caption" numberOfLines={1} style={styles.fileName}>
                  {a.fileName}
                </Text>
              </Pressable>
            );
          })}
        </View>
      ) : null}

      {p.canWrite ? (
        <>
          <View style={styles.row}>
            <Button label="Attach a photo or file" icon="paperclip" variant="secondary" compact loading={p.attaching} onPress={p.onAttach} testID="pin-attach" />
            {p.canResolve ? (
              <Button
                label={resolved ? 'Reopen' : 'Resolve'}
                icon={resolved ? 'rotate-ccw' : 'check'}
                variant="secondary"
                compact
                loading={p.resolving}
                onPress={() => p.onResolve(!resolved)}
                testID={resolved ? 'pin-reopen' : 'pin-resolve'}
              />
            ) : null}
          </View>
          <FormMessage message={p.attachError} testID="pin-attach-error" />
          <NoteBox label="Reply" sendLabel="Reply" busy={p.replying} onSend={p.onReply} testID="pin-reply" />
        </>
      ) : null}
    </View>
  );
}

function Note({ author, at, body, testID, indent }: { author: string; at: string; body: string; testID: string; indent?: boolean }) {
  const { color } = useTheme();
  return (
    <View style={[styles.note, indent && { borderLeftColor: color.line, borderLeftWidth: 2, paddingLeft: space.md }]} testID={testID}>
      <Text variant="caption" tone="muted">
        <Text variant="caption" style={{ color: color.ink }}>
          {author}
        </Text>
        {`  ·  ${formatDateTime(at)}`}
      </Text>
      <Text>{body}</Text>
    </View>
  );
}

const styles = StyleSheet.create({
  thread: { gap: space.md },
  head: { flexDirection: 'row', alignItems: 'center', gap: space.sm },
  grow: { flex: 1, minWidth: 0 },
  note: { gap: 2 },
  files: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
  file: { width: 96, borderWidth: 1, borderRadius: radius.md, overflow: 'hidden' },
  thumb: { width: 94, height: 72 },
  fileIcon: { alignItems: 'center', justifyContent: 'center', gap: 2 },
  fileName: { paddingHorizontal: 6, paddingVertical: 4 },
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
});
