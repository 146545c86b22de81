import 'server-only';
import bcrypt from 'bcryptjs';
import { UniqueConstraintError } from 'sequelize';
import { getDb } from '@/lib/db';
import { AppError } from '@/lib/http/errors';
import { SignUpInput } from '@/lib/validations/auth';

/** Self sign-up for entrants: a new person with a bcrypt password hash. */
export async function createAccount(raw: unknown) {
  const input = SignUpInput.parse(raw);
  const { User } = getDb().models;
  const taken = () =>
    new AppError('email_taken', 409, 'An account with this e-mail already exists: sign in instead.', [
      { field: 'email', message: 'An account with this e-mail already exists: sign in instead.' },
    ]);
  if (await User.findOne({ where: { email: input.email }, attributes: ['id'] })) throw taken();
  try {
    const user = await User.create({
      name: input.name,
      email: input.email,
      emailVerified: null,
      passwordHash: await bcrypt.hash(input.password, 10),
    });
    return { id: user.id, email: user.email, name: user.name };
  } catch (err) {
    if (err instanceof UniqueConstraintError) throw taken();
    throw err;
  }
}
