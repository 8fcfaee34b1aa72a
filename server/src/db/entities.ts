import { CompanySchema } from '../modules/companies/company.entity';
import { UserSchema } from '../modules/users/user.entity';

/** Every entity the ORM knows. A module adds its schema here. */
export const entities = [CompanySchema, UserSchema];
