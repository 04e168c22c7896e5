#include "stackbound/render/warnings_json.hpp"

namespace stackbound::render {

nlohmann::json warnings_json(const std::vector<units::Warning>& warnings) {
  nlohmann::json list = nlohmann::json::array();
  for (const units::Warning& warning : warnings) {
    list.push_back({{"field", warning.field}, {"value", warning.value}, {"message", warning.message}});
  }
  return list;
}

}  // namespace stackbound::render
