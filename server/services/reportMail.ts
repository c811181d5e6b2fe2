import { config } from '../config';
import { dataSource } from '../db/dataSource';
import type { Report } from '../entities';
import type { MailMessage } from '../mail/mailer';
import type { ReportStep } from './reports';

const membersWithRole = async (projectId: string, role: string): Promise<string[]> =>
  (await dataSource.query(
    `SELECT u.email FROM project_members m JOIN users u ON u.id = m.user_id WHERE m.project_id = $1 AND m.role = $2 AND u.active ORDER BY u.email`,
    [projectId, role],
  )).map((r: { email: string }) => r.email);

const emailOf = async (userId: string | null): Promise<string[]> =>
  userId ? (await dataSource.query('SELECT email FROM users WHERE id = $1 AND active', [userId])).map((r: { email: string }) => r.email) : [];

/** Who hears of each step: leads review submissions, the author hears the verdict, clients hear of sharing. */
export async function mailForStep(step: ReportStep, report: Report, actor: Express.User, comment: string): Promise<MailMessage> {
  const [context] = await dataSource.query(
    `SELECT p.name AS project, l.name AS line FROM runs r JOIN survey_lines l ON l.id = r.line_id JOIN projects p ON p.id = l.project_id WHERE r.id = $1`,
    [report.runId],
  );
  const about = `${context.project}, line ${context.line}`;
  const link = `${config.publicUrl}/reports/${report.id}`;
  const note = comment ? `\n\nComment from ${actor.name}:\n${comment}` : '';
  switch (step) {
    case 'submit':
      return { to: await membersWithRole(report.projectId, 'lead'), subject: `Report for review: ${about}`, text: `${actor.name} submitted a report for your review.${note}\n\n${link}` };
    case 'approve':
      return { to: await emailOf(report.createdBy), subject: `Report approved: ${about}`, text: `${actor.name} approved the report.${note}\n\n${link}` };
    case 'return':
      return { to: await emailOf(report.createdBy), subject: `Report returned: ${about}`, text: `${actor.name} returned the report for changes.${note}\n\n${link}` };
    case 'share':
      return {
        to: await membersWithRole(report.projectId, 'client'),
        subject: `Report available: ${about}`,
        text: `A reviewed report is ready for you to download.${note}\n\n${link}\n\nThe interpretation is non-unique and depends on calibration against boreholes; please read its limitations section.`,
      };
  }
}
