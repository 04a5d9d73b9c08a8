import bcrypt from 'bcrypt';
import type { Role } from '../../shared/api/auth';
import type { SetupStatus } from '../../shared/api/setup';
import demo from '../../fixtures/demo.json';
import { Setup, Team, User } from '../models';
import { BCRYPT_COST } from '../routes/auth';
import { seedTraining, type DemoTraining } from './training';
import { seedLibrary, type DemoLibrary } from './library';

interface DemoSetup {
  name: string;
  kind: string;
  owner: string;
  status: string;
  job: string | null;
  notes: string;
  inputs: Record<string, unknown>;
}

/**
 * Seeds the invented demo shop: its team, members and set-ups. Only what is absent is added,
 * so it can run on every start.
 */
export async function seedDemo(password: string): Promise<{ teamId: number; created: number }> {
  let created = 0;
  const [team] = await Team.findOrCreate({ where: { name: demo.team }, defaults: { name: demo.team } });
  let hash: string | null = null;
  const byEmail = new Map<string, User>();
  for (const member of demo.members) {
    let user = await User.findOne({ where: { email: member.email } });
    if (!user) {
      hash ??= await bcrypt.hash(password, BCRYPT_COST);
      user = await User.create({ teamId: team.id, email: member.email, name: member.name, role: member.role as Role, passwordHash: hash });
      created++;
    }
    byEmail.set(member.email, user);
  }
  for (const s of demo.setups as DemoSetup[]) {
    const exists = await Setup.findOne({ where: { teamId: team.id, name: s.name } });
    if (exists) continue;
    const owner = byEmail.get(s.owner);
    if (!owner) continue;
    // Written a fortnight ago: before the release stamp and the batch runs the library seed adds.
    const createdAt = new Date(Date.now() - 14 * 86_400_000);
    await Setup.create({ teamId: team.id, ownerId: owner.id, name: s.name, kind: s.kind, inputs: s.inputs, notes: s.notes, job: s.job, status: s.status as SetupStatus, createdAt, updatedAt: createdAt });
    created++;
  }
  created += await seedTraining(team.id, demo.training as DemoTraining, byEmail);
  created += await seedLibrary(team.id, demo.library as DemoLibrary, byEmail);
  return { teamId: team.id, created };
}
