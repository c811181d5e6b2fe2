import { AuditEntry } from './AuditEntry';
import { Inversion } from './Inversion';
import { Organisation } from './Organisation';
import { PickSet } from './PickSet';
import { PickSetRevision } from './PickSetRevision';
import { Station } from './Station';
import { Project } from './Project';
import { Report } from './Report';
import { Run } from './Run';
import { ProjectMember } from './ProjectMember';
import { SurveyLine } from './SurveyLine';
import { User } from './User';
import { VelocityModel } from './VelocityModel';

export { AuditEntry, Inversion, Organisation, PickSet, PickSetRevision, Project, ProjectMember, Report, Run, Station, SurveyLine, User, VelocityModel };
export const entities = [User, Project, ProjectMember, SurveyLine, AuditEntry, Station, PickSet, PickSetRevision, VelocityModel, Run, Report, Organisation, Inversion];
