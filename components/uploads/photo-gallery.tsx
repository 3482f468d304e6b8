/**
 * Photos of a mirror as mounted (`placementId`) or of the job (`placementId` null): thumbnails, the
 * full photo on a tap, delete with a confirmation, and the camera straight away on a phone. A
 * reviewer sees the photos and cannot add or delete.
 */
import { useState } from 'react';
import { Image, Modal, Pressable, ScrollView, StyleSheet, View } from 'react-native';
import { AppText, Button, Notice } from '@/components/ui';
import { palette, radii, spacing } from '@/constants/theme';
import { fileAddress, thumbnailAddress, useAddFileToCache, useDeleteFileMutation, useProjectFilesQuery } from '@/hooks/use-files';
import { describeError } from '@/shared/errors';
import type { FileDto } from '@/shared/schemas/files';
import { UploadControl } from './upload-control';

export interface PhotoGalleryProps {
  projectId: number;
  /** The mirror the photos belong to; null for photos of the job itself. */
  placementId: number | null;
  canEdit: boolean;
  /** Prefix of the test ids inside. */
  testID: string;
}

const THUMB_PX = 96;

/** The job's photos that belong here: this mirror's, or those tied to no mirror. */
export function photosFor(files: readonly FileDto[] | undefined, placementId: number | null): FileDto[] {
  return (files ?? []).filter((f) => f.kind === 'photo' && f.placementId === placementId);
}

export function PhotoGallery({ projectId, placementId, canEdit, testID }: PhotoGalleryProps) {
  const files = useProjectFilesQuery(projectId);
  const addToCache = useAddFileToCache(projectId);
  const [open, setOpen] = useState<FileDto | null>(null);
  const photos = photosFor(files.data, placementId);

  return (
    <View style={styles.root} testID={testID}>
      {files.isError ? (
        <Notice tone="stop" testID={`${testID}-load-error`}>
          {describeError(files.error)}
        </Notice>
      ) : null}
      {photos.length === 0 && files.isSuccess ? (
        <AppText tone="muted" testID={`${testID}-empty`}>
          {canEdit ? 'No photos yet.' : 'No photos.'}
        </AppText>
      ) : null}
      {photos.length > 0 ? (
        <View style={styles.grid} role="list">
          {photos.map((f) => (
            <View key={f.id} role="listitem">
              <Pressable
                testID={`${testID}-thumb-${f.id}`}
                role="button"
                aria-label={`Open photo ${f.name}`}
                onPress={() => setOpen(f)}
                style={({ hovered, pressed }) => [styles.thumb, (hovered || pressed) && styles.thumbHover]}
              >
                <Image source={{ uri: thumbnailAddress(f) }} style={styles.thumbImage} resizeMode="cover" alt={f.name} />
              </Pressable>
            </View>
          ))}
        </View>
      ) : null}
      {canEdit ? (
        <UploadControl
          projectId={projectId}
          kind="photo"
          placementId={placementId}
          testID={`${testID}-upload`}
          cameraLabel="Take a photo"
          chooseLabel="Choose a photo"
          onUploaded={addToCache}
        />
      ) : null}
      {open ? (
        <PhotoViewer projectId={projectId} photo={open} canEdit={canEdit} testID={`${testID}-viewer`} onClose={() => setOpen(null)} />
      ) : null}
    </View>
  );
}

function PhotoViewer({
  projectId,
  photo,
  canEdit,
  testID,
  onClose,
}: {
  projectId: number;
  photo: FileDto;
  canEdit: boolean;
  testID: string;
  onClose: () => void;
}) {
  const remove = useDeleteFileMutation(projectId);
  const [confirming, setConfirming] = useState(false);
  const taken = new Date(photo.createdAt);
  return (
    <Modal visible transparent animationType="fade" onRequestClose={onClose}>
      <View style={styles.backdrop}>
        <View style={styles.sheet} role="dialog" aria-label={`Photo ${photo.name}`} testID={testID}>
          <View style={styles.head}>
            <View style={styles.flex}>
              <AppText variant="bodyStrong" numberOfLines={2}>
                {photo.name}
              </AppText>
              <AppText variant="small" tone="muted">
                {`Added ${Number.isNaN(taken.getTime()) ? '' : taken.toLocaleString()} · ${photo.widthPx} × ${photo.heightPx} px`}
              </AppText>
            </View>
            <Button label="Close" variant="secondary" testID={`${testID}-close`} onPress={onClose} />
          </View>
          <ScrollView style={styles.flex} contentContainerStyle={styles.imageBox}>
            <Image
              testID={`${testID}-image`}
              source={{ uri: fileAddress(photo) }}
              style={[styles.full, { aspectRatio: photo.widthPx / photo.heightPx }]}
              resizeMode="contain"
              alt={photo.name}
            />
          </ScrollView>
          {canEdit ? (
            confirming ? (
              <View style={styles.confirm} testID={`${testID}-delete-confirmation`}>
                <AppText variant="bodyStrong">Delete this photo? It cannot be brought back.</AppText>
                <View style={styles.row}>
                  <Button
                    label="Delete photo"
                    variant="danger"
                    testID={`${testID}-delete-confirm`}
                    busy={remove.isPending}
                    onPress={() => remove.mutate(photo.id, { onSuccess: onClose })}
                  />
                  <Button label="Keep it" variant="secondary" testID={`${testID}-delete-cancel`} onPress={() => setConfirming(false)} />
                </View>
                {remove.isError ? <Notice tone="stop">{describeError(remove.error)}</Notice> : null}
              </View>
            ) : (
              <Button label="Delete this photo…" variant="danger" testID={`${testID}-delete`} onPress={() => setConfirming(true)} />
            )
          ) : null}
        </View>
      </View>
    </Modal>
  );
}

const styles = StyleSheet.create({
  root: { gap: spacing.sm },
  grid: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.sm },
  thumb: {
    width: THUMB_PX,
    height: THUMB_PX,
    borderRadius: radii.sm,
    overflow: 'hidden',
    borderWidth: 2,
    borderColor: palette.ruleSoft,
    backgroundColor: palette.chalk,
  },
  thumbHover: { borderColor: palette.glass },
  thumbImage: { width: '100%', height: '100%' },
  backdrop: { flex: 1, backgroundColor: 'rgba(20,32,43,0.72)', padding: spacing.md, justifyContent: 'center', alignItems: 'center' },
  sheet: {
    backgroundColor: palette.card,
    borderRadius: radii.lg,
    padding: spacing.md,
    gap: spacing.md,
    width: '100%',
    maxWidth: 960,
    maxHeight: '100%',
  },
  head: { flexDirection: 'row', gap: spacing.md, alignItems: 'flex-start' },
  flex: { flexGrow: 1, flexShrink: 1 },
  imageBox: { alignItems: 'center' },
  full: { width: '100%', maxWidth: 1200, backgroundColor: palette.chalk },
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.sm },
  confirm: {
    gap: spacing.sm,
    padding: spacing.md,
    borderWidth: 2,
    borderColor: palette.stop,
    borderRadius: radii.sm,
    backgroundColor: palette.stopSoft,
  },
});
