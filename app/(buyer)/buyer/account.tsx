import { BuyerAccountScreen } from "../../../components/screens/buyer/BuyerAccountScreen";

export default BuyerAccountScreen;
