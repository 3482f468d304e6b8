import { useEffect, useState } from 'react';
import { ActivityIndicator, StyleSheet, View } from 'react-native';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { Segmented } from '@/components/ui/segmented';
import { AppText } from '@/components/ui/text';
import { TextField } from '@/components/ui/text-field';
import { palette, spacing } from '@/constants/theme';
import { useProjectsQuery, type ProjectListParams } from '@/hooks/use-projects';
import { describeError } from '@/shared/errors';
import type { Role } from '@/shared/schemas';
import { ProjectRow } from './project-row';
import { ProjectsEmpty } from './projects-empty';

type Sort = NonNullable<ProjectListParams['sort']>;

/** Typing pauses this long before the server is asked, so a poor connection is not flooded. */
const SEARCH_DEBOUNCE_MS = 300;

function useDebounced<T>(value: T, ms: number): T {
  const [v, setV] = useState(value);
  useEffect(() => {
    const t = setTimeout(() => setV(value), ms);
    return () => clearTimeout(t);
  }, [value, ms]);
  return v;
}

export function ProjectsList({ role }: { role: Role }) {
  const [q, setQ] = useState('');
  const [sort, setSort] = useState<Sort>('updated');
  const query = useDebounced(q.trim(), SEARCH_DEBOUNCE_MS);
  const projects = useProjectsQuery({ q: query || undefined, sort });
  const list = projects.data;

  // With nothing at all and no search, the empty state explains what a project is.
  if (list && list.length === 0 && !query) return <ProjectsEmpty role={role} />;

  return (
    <View style={styles.column}>
      <View style={styles.controls}>
        <TextField
          name="projects-search"
          label="Search"
          testID="projects-search"
          value={q}
          onChangeText={setQ}
          placeholder="Name, customer or site"
          autoCapitalize="none"
          autoCorrect={false}
          inputMode="search"
        />
        <View style={styles.sortRow}>
          <AppText variant="label">Sort by</AppText>
          <Segmented<Sort>
            label="Sort projects by"
            value={sort}
            onChange={setSort}
            stretch
            options={[
              { value: 'updated', label: 'Recent', testID: 'projects-sort-updated' },
              { value: 'name', label: 'Name', testID: 'projects-sort-name' },
              { value: 'customer', label: 'Customer', testID: 'projects-sort-customer' },
            ]}
          />
        </View>
      </View>

      {projects.isPending ? <ActivityIndicator color={palette.glass} accessibilityLabel="Loading projects" /> : null}
      {projects.isError ? (
        <View style={styles.column}>
          <Notice tone="stop" testID="projects-error">
            {describeError(projects.error)}
          </Notice>
          <Button label="Try again" testID="projects-retry" variant="secondary" onPress={() => void projects.refetch()} />
        </View>
      ) : null}
      {list && list.length === 0 ? (
        <AppText tone="muted" testID="projects-no-match">
          {`No project matches “${query}”. Try part of the name, the customer or the site.`}
        </AppText>
      ) : null}
      {list && list.length > 0 ? (
        <View style={styles.rows} role="list" aria-label="Projects" testID="projects-list">
          {list.map((p) => (
            <ProjectRow key={p.id} project={p} showOwner={role !== 'installer'} />
          ))}
        </View>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  column: { gap: spacing.lg },
  controls: { gap: spacing.md },
  sortRow: { gap: spacing.xs },
  rows: { gap: spacing.md },
});
