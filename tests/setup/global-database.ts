import type { TestProject } from 'vitest/node';
import { createTestDatabase } from './test-database';
import './provided';

export default async function setup(project: TestProject) {
  const { connection, drop } = await createTestDatabase();
  project.provide('database', connection);
  return drop;
}
