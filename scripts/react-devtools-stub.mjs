// Ink imports react-devtools-core only when DEV is set; the bundle never needs it.
export default {initialize() {}, connectToDevTools() {}};
