import { parseSort, type UserListQuery } from '@lotwise/shared';
import { type EntityManager, In } from 'typeorm';
import { advisoryLocks, lockForWrite, takeTurn } from '../../db/postgres';
import { containsPattern } from '../../db/sql';
import { userWritten } from './user-cache';
import { UserEntity, type UserRow } from './user.entity';

const sortColumns: Record<string, string> = {
  email: 'u.email',
  displayName: 'LOWER(u.displayName)',
  role: 'u.role',
  createdAt: 'u.createdAt',
  lastLoginAt: 'u.lastLoginAt',
};

/** A row to insert; a new user starts at session version 0. */
export type NewUser = Omit<UserRow, 'id' | 'sessionVersion'> & { sessionVersion?: number };

/**
 * Data access for `users`; answers plain rows. Every write to the table is one of the write
 * methods here, and each tells the session cache (user-cache.ts) which user changed.
 */
export function usersRepository(manager: EntityManager) {
  const repo = manager.getRepository(UserEntity);
  const plain = (row: UserRow | null): UserRow | null => (row ? { ...row } : null);

  return {
    /** In a transaction on PostgreSQL the user stays locked until it ends (role, session version). */
    async findById(id: number) {
      return plain(await repo.findOne({ where: { id }, ...lockForWrite(manager) }));
    },
    async findByIds(ids: number[]): Promise<UserRow[]> {
      if (ids.length === 0) return [];
      return (await repo.findBy({ id: In(ids) })).map((row) => ({ ...row }));
    },
    async findByEmail(email: string) {
      return plain(await repo.findOneBy({ email }));
    },
    async findByInviteTokenHash(inviteTokenHash: string) {
      return plain(await repo.findOneBy({ inviteTokenHash }));
    },
    async insert(values: NewUser): Promise<UserRow> {
      const result = await repo.insert(values);
      const id = Number(result.identifiers[0]?.id);
      userWritten(manager, id);
      return (await this.findById(id)) as UserRow;
    },
    async update(id: number, changes: Partial<NewUser>): Promise<UserRow> {
      await repo.update({ id }, changes);
      userWritten(manager, id);
      return (await this.findById(id)) as UserRow;
    },
    /** Ends every session of the user: tokens carrying the old session version are refused. */
    async endSessions(id: number): Promise<void> {
      await repo.increment({ id }, 'sessionVersion', 1);
      userWritten(manager, id);
    },
    /**
     * On PostgreSQL in a transaction, changes that count the admins take turns, so two admins
     * demoting each other at once cannot leave the lab with none.
     */
    async countActiveAdmins() {
      await takeTurn(manager, advisoryLocks.adminCount);
      return repo.countBy({ role: 'admin', active: true });
    },
    count() {
      return repo.count();
    },
    async list(query: UserListQuery): Promise<{ rows: UserRow[]; total: number }> {
      const qb = repo.createQueryBuilder('u');
      if (query.q) {
        qb.where(
          "(LOWER(u.email) LIKE :q ESCAPE '\\' OR LOWER(u.displayName) LIKE :q ESCAPE '\\')",
          {
            q: containsPattern(query.q.toLowerCase()),
          },
        );
      }
      const total = await qb.getCount();
      const { field, direction } = parseSort(query.sort);
      const column = sortColumns[field] ?? 'LOWER(u.displayName)';
      const order = direction === 'desc' ? 'DESC' : 'ASC';
      const rows = await qb
        .orderBy(`CASE WHEN ${column} IS NULL THEN 1 ELSE 0 END`, 'ASC')
        .addOrderBy(column, order)
        .addOrderBy('u.id', 'ASC')
        .offset((query.page - 1) * query.pageSize)
        .limit(query.pageSize)
        .getMany();
      return { rows: rows.map((row) => ({ ...row })), total };
    },
  };
}
export type UsersRepository = ReturnType<typeof usersRepository>;
