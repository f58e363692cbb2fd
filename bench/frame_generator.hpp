// frame_generator: model text for large rectangular frames, for the bench target.
#pragma once

#include <cstddef>
#include <string>

namespace firn::bench {

/// A rectangular frame of `bays` x `storeys` with fixed bases, 24 ft bays and
/// 12 ft storeys, and `cases` load cases: case k loads every beam of one
/// storey (cycling through the storeys) and pushes every level sideways.
std::string rectangular_frame(std::size_t bays, std::size_t storeys, std::size_t cases);

/// The same frame and cases written with a grid run, generators and member
/// patterns: a few lines for the structure, one per load.
std::string generated_frame(std::size_t bays, std::size_t storeys, std::size_t cases);

/// The generated frame under dead, live and derived snow loads: the top level's
/// beams are one roof, so ASCE 7-16 Sec. 7.5.1 gives its partial arrangements
/// (case 3 on every pair of adjacent bays), and the model is combined for
/// ASCE 7-16 strength design.
std::string snow_frame(std::size_t bays, std::size_t storeys);

}  // namespace firn::bench
