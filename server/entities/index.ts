import { AuditEntry } from './AuditEntry';
import { Project } from './Project';
import { ProjectMember } from './ProjectMember';
import { SurveyLine } from './SurveyLine';
import { User } from './User';

export { AuditEntry, Project, ProjectMember, SurveyLine, User };
export const entities = [User, Project, ProjectMember, SurveyLine, AuditEntry];
