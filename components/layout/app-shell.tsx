/**
 * The signed-in frame. Phone first: a slim top bar, the screen, and a bottom bar of icon+label
 * destinations. From layout.wideMinWidthPx: a paper sidebar beside the content.
 * Pressables inside `Link asChild` get one flattened style object: on web the Link's slot passes
 * neither style functions nor arrays through.
 */
import { Link, usePathname } from 'expo-router';
import { Pressable, StyleSheet, View } from 'react-native';
import { useSafeAreaInsets } from 'react-native-safe-area-context';
import { ROLE_LABELS } from '../../constants/schemas/roles';
import { layout, palette, radii, space } from '../../constants/theme';
import { useCurrentUser } from '../../hooks/queries/session';
import { useIsWide } from '../../hooks/use-is-wide';
import { SessionSheet } from '../auth/session-sheet';
import { Wordmark } from '../brand/wordmark';
import { SkipLink } from './skip-link';
import { Icon } from '../icons';
import { Text } from '../ui/text';
import { isActive, navItemsFor, type NavItem } from './nav-items';

export function AppShell({ children }: { children: React.ReactNode }) {
  const wide = useIsWide();
  return wide ? (
    <View style={styles.wide}>
      <View role="navigation" aria-label="Skip link">
        <SkipLink />
      </View>
      <Sidebar />
      <View style={styles.main} role="main" nativeID="main-content">
        {children}
      </View>
      <SessionSheet />
    </View>
  ) : (
    <View style={styles.narrow}>
      <View role="navigation" aria-label="Skip link">
        <SkipLink />
      </View>
      <TopBar />
      <View style={styles.main} role="main" nativeID="main-content">
        {children}
      </View>
      <BottomBar />
      <SessionSheet />
    </View>
  );
}

function Sidebar() {
  const user = useCurrentUser();
  const pathname = usePathname();
  return (
    <View style={styles.sidebar} role="navigation" aria-label="Main" testID="sidebar">
      <View style={styles.sidebarBrand}>
        <Wordmark size={30} />
        <Text variant="small" tone="muted" numberOfLines={2}>
          {user.organisation.name}
        </Text>
      </View>
      <View style={styles.sidebarNav}>
        {navItemsFor(user).map((item) => (
          <SidebarLink key={item.href} item={item} active={isActive(item, pathname)} />
        ))}
      </View>
      <Link href="/profile" asChild>
        <Pressable style={styles.sidebarUser} accessibilityLabel={`Signed in as ${user.name}`}>
          <Initials name={user.name} />
          <View style={{ flex: 1 }}>
            <Text variant="smallStrong" numberOfLines={1}>
              {user.name}
            </Text>
            <Text variant="small" tone="muted" numberOfLines={1}>
              {user.roles.map((r) => ROLE_LABELS[r]).join(', ')}
            </Text>
          </View>
        </Pressable>
      </Link>
    </View>
  );
}

function SidebarLink({ item, active }: { item: NavItem; active: boolean }) {
  return (
    <Link href={item.href} asChild>
      <Pressable
        testID={`nav-${item.id}`}
        accessibilityLabel={item.label}
        aria-current={active ? 'page' : undefined}
        style={StyleSheet.flatten([styles.sidebarLink, active && styles.sidebarLinkActive])}
      >
        <Icon name={item.icon} size={20} color={active ? palette.accent : palette.inkMuted} strokeWidth={active ? 2 : 1.7} />
        <Text variant="bodyStrong" tone={active ? 'ink' : 'soft'}>
          {item.label}
        </Text>
      </Pressable>
    </Link>
  );
}

function TopBar() {
  const user = useCurrentUser();
  const insets = useSafeAreaInsets();
  return (
    <View style={[styles.topBar, { paddingTop: insets.top + space.sm }]} role="banner">
      <Wordmark size={24} />
      <Text variant="small" tone="muted" numberOfLines={1} style={styles.topOrg}>
        {user.organisation.name}
      </Text>
    </View>
  );
}

function BottomBar() {
  const user = useCurrentUser();
  const pathname = usePathname();
  const insets = useSafeAreaInsets();
  return (
    <View style={[styles.bottomBar, { paddingBottom: insets.bottom }]} role="navigation" aria-label="Main" testID="bottom-bar">
      {navItemsFor(user).map((item) => {
        const active = isActive(item, pathname);
        return (
          <Link key={item.href} href={item.href} asChild>
            <Pressable testID={`nav-${item.id}`} accessibilityLabel={item.label} aria-current={active ? 'page' : undefined} style={styles.tab}>
              <View style={[styles.tabMarker, active && styles.tabMarkerActive]} />
              <Icon name={item.icon} size={22} color={active ? palette.accent : palette.inkMuted} strokeWidth={active ? 2 : 1.7} />
              <Text variant="small" style={[styles.tabLabel, { color: active ? palette.ink : palette.inkMuted }]} numberOfLines={1}>
                {item.label}
              </Text>
            </Pressable>
          </Link>
        );
      })}
    </View>
  );
}

export function Initials({ name, size = 32 }: { name: string; size?: number }) {
  const letters = name
    .split(/\s+/)
    .filter(Boolean)
    .slice(0, 2)
    .map((p) => p[0]!.toUpperCase())
    .join('');
  return (
    <View style={[styles.initials, { width: size, height: size, borderRadius: size / 2 }]}>
      <Text variant="smallStrong" style={{ color: palette.ink, fontSize: size * 0.4 }}>
        {letters}
      </Text>
    </View>
  );
}

const styles = StyleSheet.create({
  wide: { flex: 1, flexDirection: 'row', backgroundColor: palette.paper },
  narrow: { flex: 1, backgroundColor: palette.paper },
  main: { flex: 1, minWidth: 0 },
  sidebar: {
    width: layout.sidebarWidthPx,
    backgroundColor: palette.paperDeep,
    borderRightWidth: 1,
    borderRightColor: palette.line,
    paddingHorizontal: space.md,
    paddingVertical: space.xl,
    gap: space.xl,
  },
  sidebarBrand: { paddingHorizontal: space.sm, gap: space.sm },
  sidebarNav: { gap: space.xxs, flex: 1 },
  sidebarLink: {
    flexDirection: 'row',
    alignItems: 'center',
    gap: space.md,
    minHeight: layout.touchMinPx,
    paddingHorizontal: space.md,
    borderRadius: radii.md,
    borderLeftWidth: 3,
    borderLeftColor: 'transparent',
  },
  sidebarLinkActive: { backgroundColor: palette.surface, borderLeftColor: palette.accent },
  sidebarUser: { flexDirection: 'row', alignItems: 'center', gap: space.sm, padding: space.sm, borderRadius: radii.md, borderTopWidth: 1, borderTopColor: palette.line },
  topBar: {
    flexDirection: 'row',
    alignItems: 'center',
    justifyContent: 'space-between',
    gap: space.md,
    paddingHorizontal: space.lg,
    paddingBottom: space.sm,
    backgroundColor: palette.surface,
    borderBottomWidth: 1,
    borderBottomColor: palette.line,
  },
  topOrg: { flexShrink: 1, textAlign: 'right' },
  bottomBar: { flexDirection: 'row', backgroundColor: palette.surface, borderTopWidth: 1, borderTopColor: palette.line },
  tab: { flex: 1, alignItems: 'center', justifyContent: 'center', gap: 2, minHeight: layout.bottomBarHeightPx, paddingBottom: space.xs },
  tabMarker: { position: 'absolute', top: 0, height: 3, width: 28, borderBottomLeftRadius: 3, borderBottomRightRadius: 3, backgroundColor: 'transparent' },
  tabMarkerActive: { backgroundColor: palette.accent },
  tabLabel: { fontSize: 12, lineHeight: 16 },
  initials: { backgroundColor: palette.accentSoft, alignItems: 'center', justifyContent: 'center' },
});
