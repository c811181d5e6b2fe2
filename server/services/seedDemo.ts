import type { DataSource } from 'typeorm';
import { demoLine, demoProject, demoUsers, DEMO_PASSWORD } from '../../fixtures/demo/scenario';
import { hashPassword } from '../auth/password';
import { Project, ProjectMember, SurveyLine, User } from '../entities';

/** Creates the demo accounts, project, memberships and line when absent. Safe to run again. */
export async function seedDemo(ds: DataSource): Promise<{ created: number }> {
  let created = 0;
  await ds.transaction(async (em) => {
    let project = await em.findOneBy(Project, { name: demoProject.name });
    if (!project) {
      project = await em.save(em.create(Project, demoProject));
      created++;
    }
    for (const u of demoUsers) {
      let user = await em.findOneBy(User, { email: u.email });
      if (!user) {
        const passwordHash = await hashPassword(DEMO_PASSWORD);
        user = await em.save(em.create(User, { email: u.email, name: u.name, globalRole: u.globalRole, passwordHash, active: true }));
        created++;
      }
      if (u.projectRole && !(await em.existsBy(ProjectMember, { projectId: project.id, userId: user.id }))) {
        await em.insert(ProjectMember, { projectId: project.id, userId: user.id, role: u.projectRole });
        created++;
      }
    }
    if (!(await em.existsBy(SurveyLine, { projectId: project.id, name: demoLine.name }))) {
      await em.save(em.create(SurveyLine, { projectId: project.id, ...demoLine }));
      created++;
    }
  });
  return { created };
}
