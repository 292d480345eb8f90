import { StandingOrderScreen } from "../../../components/screens/buyer/StandingOrderScreen";

export default StandingOrderScreen;
