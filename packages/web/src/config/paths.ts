// The one table of paths in the web app. Later pages (Log a miss, Notebook, Patterns, Review plans,
// Keys, Sittings) add their entries here and in the navigation table of the app shell.
export const paths = {
  signIn: {
    path: '/sign-in',
    getHref: (redirectTo?: string | null) =>
      redirectTo && redirectTo !== '/'
        ? `/sign-in?redirectTo=${encodeURIComponent(redirectTo)}`
        : '/sign-in',
  },
  createAccount: {
    path: '/create-account',
    getHref: () => '/create-account',
  },
  forgotPassword: { path: '/forgot-password', getHref: () => '/forgot-password' },
  resetPassword: {
    path: '/reset-password/:token',
    getHref: (token: string) => `/reset-password/${encodeURIComponent(token)}`,
  },
  invitation: {
    path: '/invitations/:token',
    getHref: (token: string) => `/invitations/${encodeURIComponent(token)}`,
  },
  verifyEmail: {
    path: '/verify-email/:token',
    getHref: (token: string) => `/verify-email/${encodeURIComponent(token)}`,
  },
  app: {
    root: { path: '/', getHref: () => '/' },
    students: { path: '/students', getHref: () => '/students' },
    student: { path: '/students/:studentId', getHref: (id: number) => `/students/${id}` },
    curriculum: { path: '/curriculum', getHref: () => '/curriculum' },
    answerKeys: { path: '/keys', getHref: () => '/keys' },
    answerKey: { path: '/keys/:keyId', getHref: (id: number) => `/keys/${id}` },
    sittings: { path: '/sittings', getHref: () => '/sittings' },
    newSitting: {
      path: '/sittings/new',
      getHref: (preset?: { studentId?: number; answerKeyId?: number }) => {
        const search = new URLSearchParams();
        if (preset?.studentId) search.set('studentId', String(preset.studentId));
        if (preset?.answerKeyId) search.set('answerKeyId', String(preset.answerKeyId));
        const text = search.toString();
        return text ? `/sittings/new?${text}` : '/sittings/new';
      },
    },
    sitting: { path: '/sittings/:sittingId', getHref: (id: number) => `/sittings/${id}` },
    sittingMisses: {
      path: '/sittings/:sittingId/misses',
      getHref: (id: number) => `/sittings/${id}/misses`,
    },
    logMiss: { path: '/misses/new', getHref: () => '/misses/new' },
    notebook: {
      path: '/notebook',
      getHref: (search?: string) => (search ? `/notebook?${search}` : '/notebook'),
    },
    miss: { path: '/misses/:missId', getHref: (id: number) => `/misses/${id}` },
    patterns: { path: '/patterns', getHref: () => '/patterns' },
    checkUp: { path: '/check-ups/:checkUpId', getHref: (id: number) => `/check-ups/${id}` },
    reviewPlans: {
      path: '/review-plans',
      getHref: (studentId?: number) =>
        studentId ? `/review-plans?student=${studentId}` : '/review-plans',
    },
    newReviewPlan: {
      path: '/review-plans/new',
      getHref: (studentId?: number) =>
        studentId ? `/review-plans/new?student=${studentId}` : '/review-plans/new',
    },
    reviewPlan: { path: '/review-plans/:planId', getHref: (id: number) => `/review-plans/${id}` },
    members: { path: '/members', getHref: () => '/members' },
    account: { path: '/account', getHref: () => '/account' },
  },
} as const;

/** Where to go after signing in: only same-app paths, never another site. */
export function safeRedirect(target: string | null | undefined): string {
  if (!target || !target.startsWith('/') || target.startsWith('//')) {
    return paths.app.students.getHref();
  }
  return target;
}
