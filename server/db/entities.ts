import { Bakery } from "../bakery/bakery.entity";
import { CustomerAccount } from "../accounts/account.entity";
import { User } from "../users/user.entity";
import { AuthToken } from "../auth/auth-token.entity";
import { SignInFailure } from "../auth/sign-in-attempt.entity";

/** Every entity, listed once: the DataSource, the CLI and the tests all take it from here. */
export const entities = [Bakery, CustomerAccount, User, AuthToken, SignInFailure];
