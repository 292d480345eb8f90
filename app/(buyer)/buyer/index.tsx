import { BuyerHome } from "../../../components/screens/buyer/BuyerHome";

export default BuyerHome;
