import type { User } from '../../shared/schemas/auth';
import { UserModel } from '../models';

/** Every account, oldest first (admin view). */
export async function listUsers(): Promise<User[]> {
  const users = await UserModel.findAll({ order: [['id', 'ASC']] });
  return users.map((u) => u.toUser());
}
