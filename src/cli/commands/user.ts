import { configFromEnv } from '../../config.ts';
import { parseRoles, ROLES, type Role } from '../../auth/roles.ts';
import { UsageError, UserError } from '../../errors.ts';
import { openStore, type Store } from '../../store/connect.ts';
import { migrate } from '../../store/migrate.ts';
import { addUserWithPassword, disableUser, findUserByName, listUsers, resetUserPassword, USERNAME } from '../../store/repos/users.ts';
import type { Command, CommandIo } from '../command.ts';

async function withStore<T>(io: CommandIo, run: (store: Store) => Promise<T>): Promise<T> {
  const store = await openStore(configFromEnv(io.env).database);
  try {
    await migrate(store);
    return await run(store);
  } finally {
    await store.close();
  }
}

function rolesFrom(raw: string | undefined): Role[] {
  if (!raw) throw new UsageError(`plumbline user add: give --roles, a comma-separated list of ${ROLES.join(', ')}`);
  const asked = raw.split(',').map((r) => r.trim()).filter(Boolean);
  const unknown = asked.filter((r) => !(ROLES as readonly string[]).includes(r));
  if (unknown.length) throw new UserError(`unknown role${unknown.length > 1 ? 's' : ''} ${unknown.join(', ')} — roles are ${ROLES.join(', ')}`);
  return parseRoles(asked.join(','));
}


/** `plumbline user add NAME --roles R[,R…] [--display-name TEXT]`: prints the new password once. */
export const userAddCommand: Command = {
  name: 'user add',
  summary: 'add a user with roles; prints a generated password once',
  usage: 'plumbline user add NAME --roles reviewer[,adjudicator,policy,data,admin] [--display-name TEXT]',
  options: { values: ['roles', 'display-name'], maxPositionals: 1 },
  async run(args, io) {
    const username = args.positionals[0];
    if (!username) throw new UsageError('plumbline user add: name the user');
    if (!USERNAME.test(username)) throw new UserError(`user name "${username}" must be 2–40 lower-case letters, digits, dots, hyphens or underscores`);
    const roles = rolesFrom(args.values.roles);
    return withStore(io, async (store) => {
      if (await findUserByName(store.db, username)) throw new UserError(`a user named "${username}" already exists — choose another name or reset their password`);
      const { password } = await addUserWithPassword(store.db, { username, displayName: args.values['display-name'] ?? username, roles }, null, 'cli');
      io.out(`added ${username} (${roles.join(', ')}); password: ${password}`);
      io.out('The password is shown this once. Pass it on privately.');
      return 0;
    });
  },
};

/** `plumbline user list`. */
export const userListCommand: Command = {
  name: 'user list',
  summary: 'list users with their roles and whether they are disabled',
  usage: 'plumbline user list',
  options: {},
  async run(_args, io) {
    return withStore(io, async (store) => {
      for (const u of await listUsers(store.db)) io.out(`${u.username.padEnd(16)} ${u.disabled ? 'disabled' : 'active  '} ${u.roles.padEnd(34)} ${u.display_name}`);
      return 0;
    });
  },
};

/** `plumbline user disable NAME`: ends their sessions too. */
export const userDisableCommand: Command = {
  name: 'user disable',
  summary: 'disable a user and end their sessions',
  usage: 'plumbline user disable NAME',
  options: { maxPositionals: 1 },
  async run(args, io) {
    const username = args.positionals[0];
    if (!username) throw new UsageError('plumbline user disable: name the user');
    return withStore(io, async (store) => {
      const user = await findUserByName(store.db, username);
      if (!user) throw new UserError(`there is no user "${username}" — plumbline user list shows them`);
      await disableUser(store.db, user.id, null, 'cli');
      io.out(`disabled ${username}; their sessions have ended`);
      return 0;
    });
  },
};

/** `plumbline user reset-password NAME`: a new generated password, shown once; re-enables the user. */
export const userResetPasswordCommand: Command = {
  name: 'user reset-password',
  summary: 'give a user a new generated password (shown once) and end their sessions',
  usage: 'plumbline user reset-password NAME',
  options: { maxPositionals: 1 },
  async run(args, io) {
    const username = args.positionals[0];
    if (!username) throw new UsageError('plumbline user reset-password: name the user');
    return withStore(io, async (store) => {
      const user = await findUserByName(store.db, username);
      if (!user) throw new UserError(`there is no user "${username}" — plumbline user list shows them`);
      const password = await resetUserPassword(store.db, user.id, null, 'cli');
      io.out(`new password for ${username}: ${password}`);
      io.out('The password is shown this once. Pass it on privately.');
      return 0;
    });
  },
};
