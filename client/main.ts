import './components/sheaf-app.js';
