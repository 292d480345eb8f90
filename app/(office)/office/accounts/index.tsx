import { AccountsListScreen } from "../../../../components/screens/accounts/AccountsListScreen";

export default AccountsListScreen;
