/** The exact JSON of an account: never the password hash. */
export function presentUser(u: Express.User) {
  return { id: u.id, email: u.email, name: u.name, globalRole: u.globalRole, active: u.active, createdAt: u.createdAt };
}
