import { User } from '../../db/models/user';
import { Session } from '../../db/models/session';
import { IdParamSchema, ThankYouPreferenceSchema, UserUpdateSchema, type ThankYouPreference } from '@shared/schemas/user';
import { validate } from '../../middleware/validate';
import { HttpError, notFound } from '../../lib/http-error';
import type { RouteDef } from '../route-table';

export function userRoutes(): RouteDef[] {
  return [
    {
      method: 'get', path: '/api/users/me/thank-you-mail', access: 'signed-in', summary: 'Whether you get a thank-you e-mail saying where your blankets went when they are delivered',
      handlers: [
        async (req, res) => {
          const me = await User.findByPk(req.user!.id, { attributes: ['id', 'thankYouMail'] });
          const body: ThankYouPreference = { thankYouMail: me?.thankYouMail ?? false };
          res.json(body);
        },
      ],
    },
    {
      method: 'put', path: '/api/users/me/thank-you-mail', access: 'signed-in', summary: 'Turn the thank-you e-mail on delivery on or off',
      handlers: [
        validate({ body: ThankYouPreferenceSchema }),
        async (req, res) => {
          const { thankYouMail } = req.body as ThankYouPreference;
          await User.sequelize!.transaction((transaction) => User.update({ thankYouMail }, { where: { id: req.user!.id }, transaction }));
          const body: ThankYouPreference = { thankYouMail };
          res.json(body);
        },
      ],
    },
    {
      method: 'get', path: '/api/users', access: ['coordinator'], summary: 'Everyone with an account',
      handlers: [
        async (_req, res) => {
          const users = await User.findAll({ order: [['role', 'ASC'], ['name', 'ASC']] });
          res.json({ users: users.map((u) => ({ ...u.toPublic(), createdAt: u.createdAt })) });
        },
      ],
    },
    {
      method: 'patch', path: '/api/users/:id', access: ['coordinator'], summary: 'Change a role or deactivate',
      handlers: [
        validate({ params: IdParamSchema, body: UserUpdateSchema }),
        async (req, res) => {
          const id = Number(req.params.id);
          if (id === req.user!.id) throw new HttpError(409, 'You cannot change your own role or deactivate yourself; ask another coordinator');
          const user = await User.findByPk(id);
          if (!user) throw notFound('That person');
          if (req.body.role !== undefined) user.role = req.body.role;
          if (req.body.active !== undefined) user.active = req.body.active;
          await user.save();
          if (user.active === false) await Session.destroy({ where: { userId: user.id } });
          res.json({ user: user.toPublic() });
        },
      ],
    },
  ];
}
