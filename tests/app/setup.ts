// filled in by the app tests
