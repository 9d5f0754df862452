import demo from '../../../db/demo-users.json' with { type: 'json' };

export const DEMO_LAB_SLUG = 'halden-form';
export const DEMO_PASSWORD = demo.password;
export const demoUser = (role: 'owner' | 'designer' | 'experimenter' | 'reviewer') => {
  const u = demo.users.find((x) => x.role === role);
  if (!u) throw new Error(`no demo ${role}`);
  return u;
};
