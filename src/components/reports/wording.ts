import type { ProjectRole, ReportEvent, ReportRenderState, ReportStatus, ReportStep } from '../../api/types';

/** Words for report states, steps and history, shared by every report view. */

export const REPORT_STATUS_LABELS: Record<ReportStatus, string> = {
  draft: 'Draft',
  submitted: 'Awaiting review',
  returned: 'Returned for changes',
  approved: 'Approved',
  shared: 'Shared with client',
};

export const RENDER_LABELS: Record<ReportRenderState, string> = {
  queued: 'Waiting for the worker',
  rendering: 'Being drawn',
  ready: 'Ready',
  failed: 'Could not be made',
};

export const EVENT_LABELS: Record<ReportEvent['action'], string> = {
  create: 'Started the report',
  submit: 'Submitted it for review',
  return: 'Returned it for changes',
  approve: 'Approved it',
  share: 'Shared it with the client',
};

/** The step's button, the question that confirms it, and the word for it once done. */
export const STEP_WORDING: Record<ReportStep, { button: string; confirm: string; done: string; commentHint: string }> = {
  submit: {
    button: 'Submit for review',
    confirm: 'Submit this report to the project lead for review?',
    done: 'Submitted for review.',
    commentHint: 'Optional: what the reviewer should look at, or how you answered their earlier comments.',
  },
  approve: {
    button: 'Approve',
    confirm: 'Approve this report? Its PDF is made again with you named as reviewer.',
    done: 'Approved.',
    commentHint: 'Optional: a note for the author.',
  },
  return: {
    button: 'Return with comments',
    confirm: 'Return this report to its author for changes?',
    done: 'Returned to the author.',
    commentHint: 'Required: say what needs changing.',
  },
  share: {
    button: 'Share with client',
    confirm: 'Share this report with the client members of the project? They are e-mailed a link and can download the PDF.',
    done: 'Shared with the client.',
    commentHint: 'Optional: a note that goes into the client’s e-mail.',
  },
};

/** Which status each step leaves from (mirrors the server; the server has the last word). */
const STEP_FROM: Record<ReportStep, ReportStatus[]> = {
  submit: ['draft', 'returned'],
  approve: ['submitted'],
  return: ['submitted'],
  share: ['approved'],
};

const STEP_ROLES: Record<ReportStep, ProjectRole[]> = {
  submit: ['geophysicist'],
  approve: ['lead'],
  return: ['lead'],
  share: ['lead'],
};

const STEP_ORDER: ReportStep[] = ['submit', 'approve', 'return', 'share'];

/** The steps this role may take on a report in this status, in the order the buttons show. */
export function stepsFor(role: ProjectRole | null, status: ReportStatus): ReportStep[] {
  if (!role) return [];
  return STEP_ORDER.filter((s) => STEP_ROLES[s].includes(role) && STEP_FROM[s].includes(status));
}

/** A plain sentence on where the report stands and what happens next, for the team. */
export const NEXT_FOR_TEAM: Record<ReportStatus, string> = {
  draft:
    'Only the project team can see this draft. A geophysicist checks the PDF and submits it for review; the project lead is then e-mailed.',
  submitted:
    'The project lead reviews the PDF and either approves it or returns it with comments. The author is e-mailed either way.',
  returned:
    'The project lead asked for changes (see the history below). The geophysicist answers them and submits again; if figures must change, they start a new report from the run.',
  approved:
    'The PDF is made again with the reviewer and the approved status on its cover. The project lead then shares it with the client, who is e-mailed a link.',
  shared:
    'The client members of this project can download the PDF. Nothing further is needed; a revised interpretation starts as a new report.',
};

/** Where a shared report stands, for a client. */
export const NEXT_FOR_CLIENT =
  'This report was reviewed and approved by the consultancy’s project lead and shared with you. Download the PDF and read its limitations section before relying on it.';

const dateTimeFormat = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', year: 'numeric', hour: '2-digit', minute: '2-digit' });

/** "3 Dec 2025, 14:05"; an unparseable value is shown as given. */
export function dateTime(iso: string | null | undefined): string {
  if (!iso) return '–';
  const d = new Date(iso);
  return Number.isNaN(d.getTime()) ? iso : dateTimeFormat.format(d);
}
