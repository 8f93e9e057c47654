/** Role checkboxes, each with what the role does. */
import { View } from 'react-native';
import { ROLE_ABILITIES } from '../../constants/copy';
import { ROLES, ROLE_LABELS, type Role } from '../../constants/schemas/roles';
import { palette, space } from '../../constants/theme';
import { Icon } from '../icons';
import { Checkbox } from './checkbox';
import { Text } from './text';

export function RolePicker({
  value,
  onChange,
  error,
  testIDPrefix = 'role',
  disabledRoles = [],
}: {
  value: Role[];
  onChange: (roles: Role[]) => void;
  error?: string;
  testIDPrefix?: string;
  disabledRoles?: Role[];
}) {
  const toggle = (role: Role, on: boolean) => onChange(on ? ROLES.filter((r) => r === role || value.includes(r)) : value.filter((r) => r !== role));
  return (
    <View role="group" accessibilityLabel="Roles" style={{ gap: space.xxs }}>
      {ROLES.map((role) => (
        <Checkbox
          key={role}
          label={ROLE_LABELS[role]}
          description={ROLE_ABILITIES[role]}
          checked={value.includes(role)}
          onChange={(on) => toggle(role, on)}
          disabled={disabledRoles.includes(role)}
          testID={`${testIDPrefix}-${role}`}
        />
      ))}
      {error ? (
        <View style={{ flexDirection: 'row', gap: space.xs, alignItems: 'center' }} testID={`${testIDPrefix}-error`}>
          <Icon name="warning" size={14} color={palette.fail} strokeWidth={2} />
          <Text variant="small" tone="fail">
            {error}
          </Text>
        </View>
      ) : null}
    </View>
  );
}
