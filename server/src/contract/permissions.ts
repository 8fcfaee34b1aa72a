import type { JobStatus, Role } from './enums';
import { ROLES } from './enums';

/**
 * Who may do what. The server enforces these (route policies, services); the client reads the same
 * rules to show only what would succeed. Tenant and scope (a salesperson sees only their own jobs, an
 * installer only the jobs assigned to them) are the server's job scope; the rules below take them as given.
 */

/** Anyone signed in as staff. */
export const STAFF_ROLES: readonly Role[] = ROLES;
/** The owner and estimator run the office: they assign people and may act on every job of the company. */
export const OFFICE_ROLES = ['owner', 'estimator'] as const satisfies readonly Role[];
/** Installers read the jobs assigned to them; they never change them through the job routes. */
export const JOB_EDITOR_ROLES = ['owner', 'estimator', 'salesperson'] as const satisfies readonly Role[];
/** Who may own a job as its salesperson. */
export const JOB_OWNER_ROLES = ['salesperson', 'estimator', 'owner'] as const satisfies readonly Role[];
/** Who manages the company's people, settings and e-mail. */
export const OWNER_ROLES = ['owner'] as const satisfies readonly Role[];
/** Who may be assigned to a job as its installer. */
export const INSTALLER_ROLES = ['installer'] as const satisfies readonly Role[];
/** Who opens and fills a job's commissioning record (issue 15): the installer and the office; never a salesperson. */
export const COMMISSIONING_ROLES = ['owner', 'estimator', 'installer'] as const satisfies readonly Role[];
/** Who reads the price book's settings (tax; the sell rule only the office): everyone who sells. */
export const PRICE_SETTINGS_ROLES = ['owner', 'estimator', 'salesperson'] as const satisfies readonly Role[];

/** Whether a role is in one of the groups above (the server's policies are made from the same groups). */
export const roleIn = (list: readonly Role[], role: Role): boolean => list.includes(role);
const has = roleIn;

/** Who is acting, as both ends know them: the signed-in person's id and role. */
export interface Viewer {
  readonly id: string;
  readonly role: Role;
}

export const isOfficeRole = (role: Role): boolean => has(OFFICE_ROLES, role);
/**
 * Proposals (issue 14): the office issues versions and previews their PDFs; whoever may edit the job (a
 * salesperson: their own jobs) reads its versions, what changed and the trail; an installer never.
 */
export const mayIssueProposal = (role: Role): boolean => isOfficeRole(role);
export const mayReadProposal = (role: Role): boolean => has(JOB_EDITOR_ROLES, role);
export const mayOpenProposalPdf = (role: Role): boolean => isOfficeRole(role);
export const mayEditJob = (role: Role): boolean => has(JOB_EDITOR_ROLES, role);
export const mayAssignInstaller = (role: Role): boolean => isOfficeRole(role);
/** A salesperson may make only themself a job's salesperson; the office may choose anyone who can own jobs. */
export const mayChooseSalesperson = (viewer: Viewer, salespersonId: string): boolean =>
  viewer.role !== 'salesperson' || salespersonId === viewer.id;

/**
 * The job status machine: from each status, the moves a person may make by hand and the roles that
 * may make each. Later issues add the proposal-driven moves.
 */
const EDITORS = JOB_EDITOR_ROLES;
export const JOB_STATUS_MACHINE: Readonly<Record<JobStatus, Readonly<Partial<Record<JobStatus, readonly Role[]>>>>> = {
  walkthrough: { design: EDITORS, lost: EDITORS },
  design: { walkthrough: EDITORS, proposed: EDITORS, lost: EDITORS },
  proposed: { design: EDITORS, won: EDITORS, lost: EDITORS },
  won: { installed: EDITORS },
  lost: { walkthrough: EDITORS, design: EDITORS },
  installed: {},
};

/** Every status a job may move to from `from`, whoever asks. */
export function nextStatuses(from: JobStatus): JobStatus[] {
  return Object.keys(JOB_STATUS_MACHINE[from]) as JobStatus[];
}

/** What a move may depend on beyond the role: whether the job has a proposal to stand on. */
export interface JobFacts {
  readonly hasProposal: boolean;
}

/** "Proposed" means a proposal went to the customer: a job reaches it only with a proposal. */
export const MOVES_NEEDING_PROPOSAL: readonly JobStatus[] = ['proposed'];
export const moveNeedsProposal = (to: JobStatus): boolean => MOVES_NEEDING_PROPOSAL.includes(to);
export const NEEDS_PROPOSAL_MESSAGE = 'A job is marked proposed when its proposal is sent, and this job has none yet.';

/** The facts a job record carries (JobRecord.hasProposal, from the server's jobHasProposal): both ends read them so. */
export const jobFacts = (job: { readonly hasProposal: boolean }): JobFacts => ({ hasProposal: job.hasProposal });

/** The machine's answer for the role alone, whatever the job holds. */
export function roleMayMoveJob(role: Role, from: JobStatus, to: JobStatus): boolean {
  const who = JOB_STATUS_MACHINE[from][to];
  return who !== undefined && has(who, role);
}

/** Whether this role may make this move on a job with these facts. */
export function mayMoveJob(role: Role, from: JobStatus, to: JobStatus, job: JobFacts): boolean {
  return roleMayMoveJob(role, from, to) && (!moveNeedsProposal(to) || job.hasProposal);
}

/** The moves this role may make from `from` on this job, in the machine's order. */
export function movesFor(role: Role, from: JobStatus, job: JobFacts): JobStatus[] {
  return nextStatuses(from).filter((to) => mayMoveJob(role, from, to, job));
}

/** Only a job made by mistake goes: from proposed on, the reports count it (won/lost), so it stays. */
export const DELETABLE_JOB_STATUSES: readonly JobStatus[] = ['walkthrough', 'design'];

/** The owner and estimator may delete any job of the company, a salesperson their own, an installer never. */
export function mayDeleteJob(
  viewer: Viewer,
  job: { readonly status: JobStatus; readonly salesperson: { readonly id: string } | null },
): boolean {
  if (!DELETABLE_JOB_STATUSES.includes(job.status)) return false;
  if (isOfficeRole(viewer.role)) return true;
  return viewer.role === 'salesperson' && job.salesperson?.id === viewer.id;
}
